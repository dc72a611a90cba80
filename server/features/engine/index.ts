// Public module of the engine feature: its routes (fonts, text layout).
export { engineRouter } from './engine.routes.ts';
