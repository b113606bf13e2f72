/**
 * One HTTP request on Node's own client, for what fetch cannot do: bind the
 * socket to a chosen loopback address, stream a large chunked body, and tell
 * an answer from a hang-up.
 */
import { request, type IncomingMessage } from "node:http";

export interface RawAnswer {
  status: number;
  headers: IncomingMessage["headers"];
  body: string;
}

export interface RawRequest {
  host?: string;
  port: number;
  method?: string;
  path?: string;
  headers?: Record<string, string>;
  /** Source address of the socket, e.g. "127.0.0.9" (any 127.x address works on Linux). */
  localAddress?: string;
  /** A chunked body of `count` chunks of `size` bytes, written as fast as the server reads. */
  chunks?: { size: number; count: number };
  body?: string | Buffer;
}

/** Sends one request; resolves with the answer, or "closed" when the server hung up first. */
export function rawRequest(opts: RawRequest): Promise<RawAnswer | "closed"> {
  return new Promise((resolve) => {
    const req = request({
      host: opts.host ?? "127.0.0.1",
      port: opts.port,
      method: opts.method ?? "GET",
      path: opts.path ?? "/",
      headers: opts.headers,
      localAddress: opts.localAddress,
    });
    req.on("response", (res) => {
      let body = "";
      res.setEncoding("utf8");
      res.on("data", (c: string) => (body += c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body }));
      res.on("error", () => resolve("closed"));
    });
    req.on("error", () => resolve("closed"));
    if (opts.chunks) {
      const chunk = Buffer.alloc(opts.chunks.size, 97);
      let left = opts.chunks.count;
      req.on("error", () => (left = 0));
      const write = () => {
        while (left > 0) {
          left--;
          if (!req.write(chunk)) return void req.once("drain", write);
        }
        req.end();
      };
      write();
    } else {
      req.end(opts.body);
    }
  });
}
