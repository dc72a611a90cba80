// Public module of the shops feature: its routes.
export { shopsRouter } from './shops.routes.ts';
