// The award engine's public face: the column-generation engine, its worker
// thread, and the baselines it is measured against.
export { solveAward, type AwardOptions, type AwardPhase, type AwardReport, type AwardResult, type Progress, type StrictCertificate } from "./solve.ts";
export { greedyAward } from "./greedy.ts";
export { prepareProblem, seniorityWeight, type AwardProblem, type CrewProblem } from "./problem.ts";
export { solveAwardInThread, type ThreadOptions } from "./run-in-thread.ts";
