/**
 * A reason a forward move is premature (e.g. leaving test plan without a hypothesis). The move
 * still happens when the person confirms and gives a reason; both are recorded in the history.
 */
export interface GateProblem {
  /** Stable id, "<feature>.<what>": "test_plan.no_hypothesis". */
  code: string;
  message: string;
}
