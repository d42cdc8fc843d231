// Lists every route registered in an Express 5 app by walking its router stack, so the access matrix can fail
// when a route exists that nobody wrote a row for.
import type { Express } from 'express';

// The router's layer objects are internal to the `router` package (2.x) and untyped; these are the fields read.
interface Layer {
  rawPath?: string | RegExp | (string | RegExp)[];
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

function join(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

function paths(p: Layer['rawPath'] | string[]): string[] {
  if (p === undefined) return ['/'];
  const list = Array.isArray(p) ? p : [p];
  // A RegExp mount cannot be matched against a row; name it so it shows up as unknown instead of vanishing.
  return list.map((x) => (typeof x === 'string' ? x : `regexp:${x.source}`));
}

function walk(stack: Layer[], prefix: string, out: Set<string>): void {
  for (const layer of stack) {
    if (layer.route) {
      const methods = Object.keys(layer.route.methods).filter((m) => m !== '_all' && layer.route?.methods[m]);
      for (const path of paths(layer.route.path)) for (const m of methods) out.add(`${m.toUpperCase()} ${join(prefix, path)}`);
    } else if (layer.handle?.stack) {
      for (const mount of paths(layer.rawPath)) walk(layer.handle.stack, join(prefix, mount), out);
    }
  }
}

/** Every route as "METHOD /full/pattern", e.g. "PATCH /api/users/:id". */
export function registeredRoutes(app: Express): string[] {
  const out = new Set<string>();
  walk((app.router as unknown as { stack: Layer[] }).stack, '', out);
  return [...out].sort();
}
