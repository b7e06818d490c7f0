/** Cautions shown with every piece of advice, whatever the case. */
export const GENERAL_CAUTIONS: readonly string[] = [
  'These figures are order-of-magnitude estimates for planning, from flat-plate and pipe correlations; they are not a design result.',
  'Check y+ on the real solution after the first run and adapt the near-wall mesh: the local skin friction of your geometry can differ widely from the correlation used here.',
  'Cell counts, time steps and core-hours depend on the solver, the numerics and the hardware; treat them as a factor-of-several estimate.',
  "Your organisation's procedures, the applicable local codes and standards, and licensed engineering practice take precedence over this advice.",
]
