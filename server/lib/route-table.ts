import { Session } from 'node:inspector/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Express, RequestHandler } from 'express';
import { accessRuleOf, type AccessRule } from '../middleware/require-role';

export interface RouteRow {
  method: string;
  path: string;
  access: AccessRule;
  /** The file, relative to the working directory, that defines the route's own handler. */
  file: string;
}

/** The parts of Express 5's router (router 2.x) layers this walk reads. */
interface Layer {
  rawPath?: string | string[];
  handle: RequestHandler & { stack?: Layer[] };
  method?: string;
  route?: { path: string | string[]; methods: Record<string, boolean>; stack: Layer[] };
}

export interface ListedRoute {
  /** Upper case; `ALL` for `router.all` (HEAD is left out: it comes with GET). */
  method: string;
  /** The full path as mounted, with Express parameters (`/api/account/addresses/:id`). */
  path: string;
  access: AccessRule;
  /** The route's own handler, the last in its stack. */
  handler: RequestHandler;
}

const strictness: Record<AccessRule, number> = { public: 0, customer: 1, packer: 2, staff: 3, owner: 4 };
const stricter = (a: AccessRule, b: AccessRule) => (strictness[b] > strictness[a] ? b : a);
const joined = (prefix: string, tail: string) => `${prefix}/${tail}`.replace(/\/{2,}/g, '/').replace(/(.)\/$/, '$1');
const pathsOf = (raw: string | string[] | undefined) => (raw === undefined ? ['/'] : Array.isArray(raw) ? raw : [raw]);

/** Every route of a router, depth first, with the guards met on the way (a `router.use(requireUser)` covers what follows it). */
function walk(stack: readonly Layer[], prefix: string, inherited: AccessRule, found: ListedRoute[]): void {
  let access = inherited;
  for (const layer of stack) {
    if (layer.route) {
      const handlers = layer.route.stack.map((entry) => entry.handle);
      const routeAccess = handlers.reduce<AccessRule>((rule, handler) => stricter(rule, accessRuleOf(handler) ?? 'public'), access);
      const methods = Object.keys(layer.route.methods).filter((method) => method !== 'head');
      for (const routePath of pathsOf(layer.route.path)) {
        for (const method of methods)
          found.push({
            method: method === '_all' ? 'ALL' : method.toUpperCase(),
            path: joined(prefix, routePath),
            access: routeAccess,
            handler: handlers.at(-1)!,
          });
      }
    } else if (layer.handle.stack) {
      for (const mountPath of pathsOf(layer.rawPath)) walk(layer.handle.stack, joined(prefix, mountPath), access, found);
    } else {
      const rule = accessRuleOf(layer.handle);
      if (rule) access = stricter(access, rule);
    }
  }
}

/** Where V8 says each function was written, read through the inspector (the same source map-free location a stack trace gives). */
async function sourceFilesOf(handlers: readonly RequestHandler[]): Promise<string[]> {
  const session = new Session();
  session.connect();
  const scripts = new Map<string, string>();
  session.on('Debugger.scriptParsed', ({ params }) => scripts.set(params.scriptId, params.url));
  await session.post('Debugger.enable');
  const holder = globalThis as { __restdayRouteHandlers?: readonly RequestHandler[] };
  holder.__restdayRouteHandlers = handlers;
  try {
    const files: string[] = [];
    for (let index = 0; index < handlers.length; index++) {
      const { result } = await session.post('Runtime.evaluate', { expression: `globalThis.__restdayRouteHandlers[${index}]` });
      const { internalProperties = [] } = await session.post('Runtime.getProperties', { objectId: result.objectId! });
      const location = internalProperties.find((property) => property.name === '[[FunctionLocation]]')?.value?.value as { scriptId: string } | undefined;
      const url = location ? scripts.get(location.scriptId) : undefined;
      files.push(url ? path.relative(process.cwd(), url.startsWith('file:') ? fileURLToPath(url) : url) : 'unknown');
    }
    return files;
  } finally {
    delete holder.__restdayRouteHandlers;
    session.disconnect();
  }
}

/** Every method and path the app answers, read from Express's own router stack, with who may call it. */
export function listRoutes(app: Express): ListedRoute[] {
  const found: ListedRoute[] = [];
  walk((app.router as unknown as { stack: Layer[] }).stack, '', 'public', found);
  return found;
}

/** Every `/api` route of the app: method, full path, who may call it, and the file that serves it. */
export async function routeTable(app: Express): Promise<RouteRow[]> {
  const apiRoutes = listRoutes(app).filter((route) => route.path.startsWith('/api/'));
  const files = await sourceFilesOf(apiRoutes.map((route) => route.handler));
  return apiRoutes.map(({ method, path: routePath, access }, index) => ({ method, path: routePath, access, file: files[index]! }));
}
