// Verification after the run: grid convergence, the wall y+ check and the cost calibration.
export * from './grid-convergence'
export * from './wall-yplus'
export * from './wall-check'
export * from './calibration'
export * from './limits'
export * from './records'
