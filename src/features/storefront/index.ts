// What other features may use of the storefront: its studio query, to refresh it after a change.
export { studioQueries } from './api/get-studio.ts';
