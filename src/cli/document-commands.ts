/**
 * The commands beyond `run` that read a document: sealing, verifying and run sheets. One
 * module for src/cli/lazy-commands.ts to load when one of them is asked for, so that
 * `furrow run` starts without compiling them (the seal and its hashing among them).
 */
export { sealCommand } from './seal.ts';
export { verifyCommand } from './verify.ts';
export { sheetCommand } from './sheet.ts';
