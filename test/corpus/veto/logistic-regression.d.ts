// The two-class model of the registry package `ml-logistic-regression` (its package entry exports only
// the one-vs-all wrapper, which would train the same two-class model twice).
declare module 'ml-logistic-regression/src/logreg_2classes.js' {
  import type { Matrix } from 'ml-matrix';
  export default class LogisticRegressionTwoClasses {
    constructor(options?: { numSteps?: number; learningRate?: number; weights?: Matrix | null });
    weights: Matrix;
    train(features: Matrix, target: Matrix): void;
    testScores(features: Matrix): number[];
  }
}
