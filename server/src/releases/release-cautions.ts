/**
 * The cautions Clinometer shows wherever results are released (DESIGN.md, "Cautions the product
 * shows"): in every release mail, below the facts of the release.
 */
export const RELEASE_CAUTIONS = [
  'These results are estimates from a sample and a model.',
  'The CAPM rests on strong assumptions: mean-variance investors, homogeneous expectations, and borrowing and lending without frictions at the risk-free rate.',
  'The market index is only a proxy for the market portfolio.',
  'Historical betas may not hold going forward.',
  "Clinometer supports the firm's valuation policy; it does not replace that policy or licensed professional judgement, and it is not investment advice.",
] as const;
