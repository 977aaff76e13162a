// The tests read the app's routes the way `npm run routes` does.
export { listRoutes, type ListedRoute } from '../../server/lib/route-table';
