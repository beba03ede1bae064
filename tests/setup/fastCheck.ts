// Property tests (fast-check) run from one fixed seed, so a run of the suite (and CI) is
// repeatable: a failure names its seed and counterexample and happens again on the next run.
// RUNGS_FC_SEED=N runs them from another seed; RUNGS_FC_RANDOM=1 from a fresh random one each
// time, to look for new counterexamples (DEVELOPERS.md, "Property tests").
import fc from 'fast-check';

const FIXED_SEED = 20261202;

const given = process.env.RUNGS_FC_SEED;
if (given !== undefined && !/^-?\d+$/.test(given)) throw new Error(`RUNGS_FC_SEED must be a whole number, not "${given}"`);
const seed = given !== undefined ? Number(given) : process.env.RUNGS_FC_RANDOM === '1' ? undefined : FIXED_SEED;
if (seed !== undefined) fc.configureGlobal({ ...fc.readConfigureGlobal(), seed });
