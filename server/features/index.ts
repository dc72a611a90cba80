import type { Router } from 'express';
import type { AppDeps } from '../app.ts';

type Mounted = { path: string; router: Router };

/**
 * Every feature's router, in one list so app.ts stays short. `raw` routers mount before the JSON
 * body parser (for signed webhooks that must see the raw bytes); `json` ones after it.
 */
export function featureRouters(_deps: AppDeps): { raw: Mounted[]; json: Mounted[] } {
  return {
    raw: [],
    json: [],
  };
}
