// POSTs JSON with XMLHttpRequest so the island can show upload progress (fetch cannot report it).
import { ApiError } from "@/lib/query/fetch-json";

export interface UploadProgress {
  /** 0–1 while the body is sent; null once it is sent and the desk is working on it. */
  fraction: number | null;
}

export function postJsonWithProgress<T>(
  url: string,
  body: unknown,
  onProgress: (p: UploadProgress) => void,
): Promise<T> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.setRequestHeader("Content-Type", "application/json");
    xhr.setRequestHeader("Accept", "application/json");
    xhr.upload.onprogress = (e) =>
      onProgress({ fraction: e.lengthComputable ? e.loaded / e.total : null });
    xhr.upload.onload = () => onProgress({ fraction: null });
    xhr.onerror = () =>
      reject(new ApiError(0, "The desk could not be reached. Check the connection and try again."));
    xhr.onload = () => {
      let parsed: { error?: { message?: string; fields?: Record<string, string> } } | null = null;
      try {
        parsed = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        parsed = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(parsed as T);
      else
        reject(
          new ApiError(
            xhr.status,
            parsed?.error?.message ?? `The desk answered ${xhr.status}.`,
            parsed?.error?.fields ?? {},
          ),
        );
    };
    xhr.send(JSON.stringify(body));
  });
}
