import { toNextJsHandler } from "better-auth/next-js";
import { auth } from "@/lib/auth";
import { serveAuth } from "@/lib/auth-http";

const handler = toNextJsHandler(auth);

/** The sign-in library's endpoints that the pages use (lib/auth-http.ts lists them); all others answer 404. */
export const GET = (req: Request) => serveAuth(req, handler.GET);
export const POST = (req: Request) => serveAuth(req, handler.POST);
