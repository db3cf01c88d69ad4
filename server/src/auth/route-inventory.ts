import type { Express } from 'express';

interface LayerLike {
  rawPath?: unknown;
  route?: { path?: unknown; methods?: Record<string, boolean> };
  handle?: { stack?: unknown };
}

function isLayerList(value: unknown): value is LayerLike[] {
  return Array.isArray(value);
}

function joinPath(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

function pathsOf(raw: unknown): string[] {
  if (typeof raw === 'string') return [raw];
  if (Array.isArray(raw)) return raw.filter((p): p is string => typeof p === 'string');
  return [];
}

function walk(layers: LayerLike[], prefix: string, out: Set<string>): void {
  for (const layer of layers) {
    if (layer.route) {
      const methods = Object.keys(layer.route.methods ?? {}).filter((m) => m !== '_all');
      for (const path of pathsOf(layer.route.path)) for (const method of methods) out.add(`${method.toUpperCase()} ${joinPath(prefix, path)}`);
    } else if (isLayerList(layer.handle?.stack)) {
      const mounts = pathsOf(layer.rawPath);
      for (const mount of mounts.length > 0 ? mounts : ['/']) walk(layer.handle.stack, joinPath(prefix, mount), out);
    }
  }
}

/**
 * Every route registered in the app, as the role matrix names them ("METHOD /api/path/:param"), found by
 * walking Express 5's router stack (layers keep their mount path in `rawPath`).
 */
export function registeredRoutes(app: Express): string[] {
  const out = new Set<string>();
  walk(app.router.stack as LayerLike[], '', out);
  return [...out].sort();
}
