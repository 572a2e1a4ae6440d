import type { FactoryFunctionMap, MathJsFactory, MathJsInstance } from "mathjs";

/*
 * The web build's unit engine: the same instance as units.ts (`create(unitDependencies)`), with
 * each factory required from its own file. Metro does not tree-shake, so the package root would
 * ship all of mathjs (~930 KiB) for this. The list is the closure of `unitDependencies`;
 * tests/unit/units.test.ts fails when a mathjs release changes it. Metro resolves these paths,
 * which the package does not export, through metro.config.js.
 */
const factories: FactoryFunctionMap = {
  createAbs: require("mathjs/lib/cjs/function/arithmetic/abs.js").createAbs,
  createAddScalar: require("mathjs/lib/cjs/function/arithmetic/addScalar.js").createAddScalar,
  createBigNumberClass: require("mathjs/lib/cjs/type/bignumber/BigNumber.js").createBigNumberClass,
  createBignumber: require("mathjs/lib/cjs/type/bignumber/function/bignumber.js").createBignumber,
  createCeil: require("mathjs/lib/cjs/function/arithmetic/ceil.js").createCeil,
  createComplexClass: require("mathjs/lib/cjs/type/complex/Complex.js").createComplexClass,
  createConcat: require("mathjs/lib/cjs/function/matrix/concat.js").createConcat,
  createConj: require("mathjs/lib/cjs/function/complex/conj.js").createConj,
  createDenseMatrixClass: require("mathjs/lib/cjs/type/matrix/DenseMatrix.js").createDenseMatrixClass,
  createDet: require("mathjs/lib/cjs/function/matrix/det.js").createDet,
  createDivideScalar: require("mathjs/lib/cjs/function/arithmetic/divideScalar.js").createDivideScalar,
  createDot: require("mathjs/lib/cjs/function/matrix/dot.js").createDot,
  createEqual: require("mathjs/lib/cjs/function/relational/equal.js").createEqual,
  createEqualScalar: require("mathjs/lib/cjs/function/relational/equalScalar.js").createEqualScalar,
  createFix: require("mathjs/lib/cjs/function/arithmetic/fix.js").createFix,
  createFloor: require("mathjs/lib/cjs/function/arithmetic/floor.js").createFloor,
  createFormat: require("mathjs/lib/cjs/function/string/format.js").createFormat,
  createFraction: require("mathjs/lib/cjs/type/fraction/function/fraction.js").createFraction,
  createFractionClass: require("mathjs/lib/cjs/type/fraction/Fraction.js").createFractionClass,
  createIdentity: require("mathjs/lib/cjs/function/matrix/identity.js").createIdentity,
  createInv: require("mathjs/lib/cjs/function/matrix/inv.js").createInv,
  createIsInteger: require("mathjs/lib/cjs/function/utils/isInteger.js").createIsInteger,
  createIsNumeric: require("mathjs/lib/cjs/function/utils/isNumeric.js").createIsNumeric,
  createIsZero: require("mathjs/lib/cjs/function/utils/isZero.js").createIsZero,
  createMatrix: require("mathjs/lib/cjs/type/matrix/function/matrix.js").createMatrix,
  createMatrixClass: require("mathjs/lib/cjs/type/matrix/Matrix.js").createMatrixClass,
  createMultiply: require("mathjs/lib/cjs/function/arithmetic/multiply.js").createMultiply,
  createMultiplyScalar: require("mathjs/lib/cjs/function/arithmetic/multiplyScalar.js").createMultiplyScalar,
  createNumber: require("mathjs/lib/cjs/type/number.js").createNumber,
  createNumeric: require("mathjs/lib/cjs/function/utils/numeric.js").createNumeric,
  createPow: require("mathjs/lib/cjs/function/arithmetic/pow.js").createPow,
  createRound: require("mathjs/lib/cjs/function/arithmetic/round.js").createRound,
  createSize: require("mathjs/lib/cjs/function/matrix/size.js").createSize,
  createSparseMatrixClass: require("mathjs/lib/cjs/type/matrix/SparseMatrix.js").createSparseMatrixClass,
  createSubtractScalar: require("mathjs/lib/cjs/function/arithmetic/subtractScalar.js").createSubtractScalar,
  createToBest: require("mathjs/lib/cjs/function/unit/toBest.js").createToBest,
  createTyped: require("mathjs/lib/cjs/core/function/typed.js").createTyped,
  createUnaryMinus: require("mathjs/lib/cjs/function/arithmetic/unaryMinus.js").createUnaryMinus,
  createUnitClass: require("mathjs/lib/cjs/type/unit/Unit.js").createUnitClass,
  createUnitFunction: require("mathjs/lib/cjs/type/unit/function/unit.js").createUnitFunction,
  createZeros: require("mathjs/lib/cjs/function/matrix/zeros.js").createZeros,
};

const create: MathJsFactory["create"] = require("mathjs/lib/cjs/core/create.js").create;

export type { Unit } from "mathjs";

export const { unit }: Pick<MathJsInstance, "unit"> = create(factories);
