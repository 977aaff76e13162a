import type { AppDeps } from '../../app-deps';
import type { ApiModule } from '../../lib/api-module';
import { healthRoutes } from './health.routes';

export function createHealthModule(deps: Pick<AppDeps, 'database' | 'queue'>): ApiModule {
  return { mounts: [{ path: '/health', router: healthRoutes(deps) }] };
}
