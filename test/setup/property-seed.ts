// Property tests draw their cases from a random seed on every local run (fast-check's default),
// so that each run explores new cases; a failure prints the seed and path to replay it. Under
// CI (CI set, as .ci/run sets it) every property starts from one fixed seed instead, so that
// whether a commit lands does not depend on the draw: a case a local run finds is fixed and
// then kept as a named example in its test, not left to chance.
import fc from 'fast-check';

if (process.env.CI) fc.configureGlobal({ seed: 20261204 });
