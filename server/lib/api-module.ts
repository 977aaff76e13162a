import type { Router } from 'express';

/** One router and the path under `/api` it is mounted at; its routes are written relative to that path. */
export interface ApiMount {
  path: string;
  router: Router;
}

/**
 * A feature module as the composition root (app.ts) sees it: the routers it mounts. Most modules
 * mount once; one whose routes sit in two URL areas (packing: `/roastery/days` and `/orders`)
 * mounts once per area.
 */
export interface ApiModule {
  mounts: readonly ApiMount[];
}
