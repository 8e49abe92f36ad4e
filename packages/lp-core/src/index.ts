export { solve } from './solve';
export type { Problem, CscMatrix } from './problem/problem';
export type { SolveResult, SolveStatus, Certificate, InfeasibilityRay, IterationInfo } from './solution/result';
export { defaultIpmSettings, resolveSettings, type IpmSettings } from './settings';
export { validateProblem, ProblemInputError } from './validate';
export { problemFromDense, problemFromTriplets, type DenseProblemInput, type TripletProblemInput } from './problem/build';
export { certify } from './solution/certificate';
export { cscFromTriplets, transpose, multiplyAx, multiplyATy } from './sparse/csc';
