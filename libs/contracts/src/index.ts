// Types shared by the API, the runner and the web app. Types and constants only, no behaviour.
export * from './error';
export * from './auth';
export * from './notebooks';
export * from './queue';
export * from './review';
export * from './records';
export * from './lock-record';
