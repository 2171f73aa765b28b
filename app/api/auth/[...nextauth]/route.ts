import NextAuth from "next-auth";
import { NextRequest } from "next/server";
import { authOptions } from "@/lib/auth/options";
import { errorResponse } from "@/lib/http";
import { readBodyText } from "@/lib/security/request-body";

const handler = NextAuth(authOptions);

type Segment = { params: Promise<{ nextauth: string[] }> };

/**
 * next-auth reads the sign-in form itself, with no limit; anyone can post to it, so the body
 * goes through the same size limit as every other route first and next-auth gets a copy.
 */
async function limited(request: NextRequest, segment: Segment): Promise<Response> {
  let text: string;
  try {
    text = await readBodyText(request);
  } catch (error) {
    return errorResponse(error);
  }
  return handler(new NextRequest(request.url, { method: request.method, headers: request.headers, body: text }), segment);
}

export { handler as GET, limited as POST };
