/**
 * The part of mathjs that unit conversion needs, through its factory functions, so that a
 * bundler keeps only the unit system (about a quarter of the library) and not the rest.
 *
 * Only two places import this file: the page's evaluation worker, which hands it to
 * `provideUnitLibrary` (src/functions/units.ts), and the command line's build
 * (scripts/build-cli.mjs), which bundles it into build/cli/chunks/unit-library.cjs for the command
 * line to load at its first conversion. The registry itself never imports mathjs, because
 * loading the whole package costs seconds in Node and most documents convert nothing.
 */
export { create, createUnitDependencies, unitDependencies } from 'mathjs';
