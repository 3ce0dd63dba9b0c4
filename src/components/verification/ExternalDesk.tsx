// The external-forecasts island (a query client for the upload form).
import { QueryClientProvider } from "@tanstack/react-query";
import { getQueryClient } from "@/lib/query/client";
import { ExternalUpload } from "./ExternalUpload";

export function ExternalDesk() {
  return (
    <QueryClientProvider client={getQueryClient()}>
      <ExternalUpload />
    </QueryClientProvider>
  );
}
