/**
 * A run form's messages by field, named as the server names them in its fieldErrors ("rawTimeSec", "runNumber",
 * "hotPressuresKpa.lf"; "_" for the run as a whole), so that the phone's own checks and a refused upload mark the
 * same fields the same way.
 */
export type RunFormErrors = Partial<Record<string, string>>;

/** Is anything marked? A cleared field's message is left as undefined. */
export const anyRefused = (errors: RunFormErrors) => Object.values(errors).some(Boolean);

export { showFirstRefused } from '@/lib/show-first-refused';
