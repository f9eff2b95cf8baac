/**
 * The single place `lib/stats` touches jStat.
 *
 * jStat's CommonJS build assigns the jStat function to `module.exports` and
 * also hangs it on itself as `.jStat`. vitest, tsx and Next's bundler all map a
 * default import of a CommonJS module to `module.exports`, so reading `.jStat`
 * from the default import works in each of them (checked under vitest, tsx and
 * an esbuild browser bundle).
 */
import jstatPkg from "jstat";

export const jStat = jstatPkg.jStat;
