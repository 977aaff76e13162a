// The whole Restday schema: every table and enum. `import * as schema from './schema/index'`.
export * from './enums';
export type { AddressSnapshot } from './common';
export * from './accounts';
export * from './catalog';
export * from './orders';
export * from './subscriptions';
export * from './roastery';
export * from './journal';
export * from './messaging';
export * from './payments';
