// One HTTP request on its own connection (no keep-alive), for bodies the server may refuse
// unread: a refused connection then cannot break the next request of a shared fetch pool.
import http from "node:http";

export interface RawAnswer {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: string;
}

export function sendRaw(
  url: string,
  init: { method: string; headers?: Record<string, string>; body?: string | Buffer },
): Promise<RawAnswer> {
  return new Promise((resolve, reject) => {
    const request = http.request(
      url,
      { method: init.method, headers: init.headers, agent: false },
      (res) => {
        const chunks: Buffer[] = [];
        res.on("data", (c: Buffer) => chunks.push(c));
        res.on("end", () =>
          resolve({
            status: res.statusCode ?? 0,
            headers: res.headers,
            body: Buffer.concat(chunks).toString("utf8"),
          }),
        );
        res.on("error", reject);
      },
    );
    // The server may answer and close before the whole body is written; the answer still counts.
    request.on("error", (err: NodeJS.ErrnoException) => {
      if (err.code !== "EPIPE" && err.code !== "ECONNRESET") reject(err);
    });
    request.end(init.body);
  });
}
