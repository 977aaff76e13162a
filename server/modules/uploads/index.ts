import type { Db } from '../../db/client';
import type { FileStorage } from '../../integrations/storage';
import type { ApiModule } from '../../lib/api-module';
import { createUploadsRepo } from './uploads.repo';
import { uploadsRoutes } from './uploads.routes';
import { createUploadsService } from './uploads.service';

export { detectFileType, fileSignatures, type FileType } from './file-signature';

export function createUploadsModule({ db, storage }: { db: Db; storage: FileStorage }): ApiModule {
  return { mounts: [{ path: '/uploads', router: uploadsRoutes(createUploadsService(createUploadsRepo(db), storage)) }] };
}
