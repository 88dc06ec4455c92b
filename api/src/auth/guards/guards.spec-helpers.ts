import type { ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';

/** An ExecutionContext for one handler of a controller class, with the given request. */
export function httpContext(
  controller: new (...args: never[]) => object,
  handlerName: string,
  req: Partial<Request>,
): ExecutionContext {
  const handler = (controller.prototype as Record<string, () => unknown>)[handlerName];
  return {
    getClass: () => controller,
    getHandler: () => handler,
    switchToHttp: () => ({ getRequest: () => req, getResponse: () => ({}), getNext: () => undefined }),
  } as unknown as ExecutionContext;
}
