// What every check returns beside its figures: the rule it applies and the cautions to show.

export interface Sourced {
  /** The published rule, standard or practice the result comes from. */
  source: string;
  cautions: string[];
}

/** Shown wherever a check touches gas pressure, combustion or venting. */
export const GAS_CAUTION =
  'Gas work is for qualified, licensed technicians only. Follow the manufacturer’s installation ' +
  'instructions and the code in force locally (in the US the National Fuel Gas Code, NFPA 54/ANSI ' +
  'Z223.1; in Canada CSA B149.1), which override anything here. Shut the gas off before opening a ' +
  'test port, leak-test every fitting that was opened, and check for CO. This is an estimate, not an approval.';

export const ESTIMATE_CAUTION =
  'Calculators give estimates, not approvals: confirm with the manufacturer’s instructions.';

export const round = (value: number, places = 2) => {
  const f = 10 ** places;
  return Math.round(value * f) / f;
};
