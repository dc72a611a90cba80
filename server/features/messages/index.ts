// Public module of the order-messages feature: its routes.
export { messagesRouters } from './messages.routes.ts';
