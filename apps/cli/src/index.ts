// Programmatic entry of the command line (tests and other tools); the bin is dist/main.js.
export { main, EXIT_USAGE, EXIT_INTERNAL } from './cli';
export { COMMANDS } from './commands/registry';
export type { Command, CommandIo } from './command';
export { parseInteger, parseIntegerList, parseSmallInteger } from './numbers';
export { groupDigits, toJson, THIN_SPACE } from './format';
