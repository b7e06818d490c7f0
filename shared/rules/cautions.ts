/**
 * The general cautions: the one source for every advice, page footer, mail and PDF record.
 * GENERAL_CAUTIONS are listed in full with each advice; CAUTION_SUMMARY says the same in two
 * sentences where space is short (page footers, e-mails).
 */

/** Cautions shown with every piece of advice, whatever the case. */
export const GENERAL_CAUTIONS: readonly string[] = [
  'These figures are order-of-magnitude estimates for planning, from published correlations and scaling laws; they are not a design result.',
  'Check y+ on the real solution after the first run and adapt the near-wall mesh: the local skin friction of your geometry can differ widely from the correlation used here.',
  'Cell counts, time steps and core-hours depend on the solver, the numerics and the hardware; each is given with its uncertainty range, and the range is part of the estimate.',
  "Your organisation's procedures, the applicable local codes and standards, and licensed engineering practice take precedence over this advice.",
]

/** The general cautions in two sentences, for page footers and e-mails. */
export const CAUTION_SUMMARY =
  "Eddyledger's figures are order-of-magnitude estimates to guide a modelling decision, not results. " +
  "Verify y+ and mesh adequacy on the real solution; defer to your organisation's procedures, the applicable local codes and licensed engineering practice."
