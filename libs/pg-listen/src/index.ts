// PostgreSQL LISTEN with reconnection, shared by the API and the runners (Node only).
export { PgListener, type PgListenerLog, type PgListenerOptions } from './pg-listener';
