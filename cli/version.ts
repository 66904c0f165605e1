import pkg from '../package.json' with { type: 'json' };

/** The app's version, from package.json (inlined by the bundler). */
export const VERSION: string = pkg.version;
