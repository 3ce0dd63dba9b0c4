// Wraps an endpoint so thrown AppErrors become JSON error responses and nothing leaks as a 500 page.
import type { APIContext, APIRoute } from "astro";
import { errorResponse } from "./errors";

export function withApi(route: (context: APIContext) => Promise<Response> | Response): APIRoute {
  return async (context) => {
    try {
      return await route(context);
    } catch (err) {
      return errorResponse(err);
    }
  };
}

export function json(data: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return Response.json(data, { status, headers });
}

export function noContent(): Response {
  return new Response(null, { status: 204 });
}
