import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { AppError, errorBody, toAppError } from "./errors";
import { executeForRequest, type Operation } from "./operation";

type RouteContext = { params: Promise<Record<string, string | string[]>> };

export function jsonError(error: unknown): NextResponse {
  const appError = toAppError(error);
  return NextResponse.json(errorBody(appError), { status: appError.status });
}

/** Reads a JSON body; a malformed body is a 400 in the one error shape. */
export async function readJson(request: Request): Promise<unknown> {
  const text = await request.text();
  if (!text) return {};
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The request body is not valid JSON");
  }
}

/**
 * A route handler for an operation: the request becomes the raw input (`toInput`), the
 * operation checks session, permission and input, and every failure answers in the one shape.
 */
export function routeHandler<S extends z.ZodType, O>(
  op: Operation<S, O>,
  toInput: (request: Request, params: Record<string, string | string[]>) => Promise<unknown> | unknown,
  options: { status?: number; respond?: (result: O) => Response } = {},
) {
  return async (request: Request, context: RouteContext): Promise<Response> => {
    try {
      const params = context?.params ? await context.params : {};
      const result = await executeForRequest(op, await toInput(request, params));
      return options.respond ? options.respond(result) : NextResponse.json(result, { status: options.status ?? 200 });
    } catch (error) {
      return jsonError(error);
    }
  };
}

const serialised = new WeakMap<object, Uint8Array>();

/**
 * JSON of an answer shared between requests (a kept, read-only result such as a cached register
 * page), serialised and encoded once for as long as the answer itself is kept.
 */
export function sharedJson(result: object): Response {
  let body = serialised.get(result);
  if (body === undefined) {
    body = new TextEncoder().encode(JSON.stringify(result));
    serialised.set(result, body);
  }
  return new Response(body as BodyInit, { headers: { "content-type": "application/json" } });
}

export const queryParams = (request: Request) => Object.fromEntries(new URL(request.url).searchParams);
