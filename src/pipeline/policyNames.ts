/**
 * The two policies the pipeline names itself, as the engineer reads them. The pipeline keeps its
 * names (`PRESENT_CONTROLLER_NAME`, `BEHAVIOUR_NAME`: the values in `--json` and saved results that
 * comparisons and rankings refer to); every host shows them through `policyLabel`, so the app, the
 * report, the figures and the command line's text say "present controller" and "logged return" and
 * nothing else (DEVELOPERS.md, "Words used in the code"; test/pipeline/controllerNames.test.ts).
 */
import { LOGGED_RETURN, PRESENT_CONTROLLER } from '../figures/parts/plotTheme';
import { BEHAVIOUR_NAME } from './assessAssembly';
import { PRESENT_CONTROLLER_NAME } from './plan/presentController';

/** The logged return's name in results saved by an earlier version, still read back as the logged return. */
const EARLIER_BEHAVIOUR_NAME = 'present controller, logged return';

/** A policy's name as shown: the pipeline's own two names read as their labels, a candidate's as given. */
export function policyLabel(name: string): string {
  if (name === PRESENT_CONTROLLER_NAME) return PRESENT_CONTROLLER;
  return name === BEHAVIOUR_NAME || name === EARLIER_BEHAVIOUR_NAME ? LOGGED_RETURN : name;
}
