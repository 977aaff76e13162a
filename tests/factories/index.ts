// Test data: every invented row the API and reliability tests write straight to the test database
// comes from here (the e2e tests read the demo seed). Each builder gives the row the product's
// own flow would leave, with defaults a test overrides only where its story needs to.
export * from './addresses';
export * from './batches';
export * from './journal';
export * from './lots';
export * from './orders';
export * from './settings';
export * from './subscriptions';
export * from './unique';
export * from './users';
