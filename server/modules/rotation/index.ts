import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import type { AuditTrail } from '../audit';
import { createRotationRepo } from './rotation.repo';
import { rotationRoutes } from './rotation.routes';
import { createRotationService } from './rotation.service';

export function createRotationModule({ db, clock, audit }: { db: Db; clock: Clock; audit: AuditTrail }): ApiModule {
  return { mounts: [{ path: '/roastery/rotation', router: rotationRoutes(createRotationService({ repo: createRotationRepo(db), clock, audit })) }] };
}
