/** What every sizing result carries, on a screen or in a document: these are estimates, not design authority. */
export const SIZING_CAUTION =
  "Preliminary sizing estimates. Use your project's own margin policy, higher-fidelity analysis and licensed engineering practice for design decisions.";
