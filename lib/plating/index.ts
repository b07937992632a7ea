// Public API of the plating calculation engine: pure functions, no I/O, safe in Node and browsers.

export { PlatingInputError, StlError, type StlErrorCode } from './errors';
export { FARADAY_C_PER_MOL, FARADAY_AH_PER_MOL } from './constants';
export { PLATING_METALS, getMetal, findMetal, listKnownMetals, type PlatingMetal, type PlatingElement } from './metals';
export {
  plateCalc,
  plateCalcFor,
  thicknessFromCharge,
  thicknessFromChargeFor,
  electrochemicalEquivalent,
  depositRateUmPerHour,
  depositRateForDeposit,
  depositOfMetal,
  alloyElectrochemicalEquivalent,
  alloyDensity,
  alloyDeposit,
  type Deposit,
  type AlloyComponent,
  type PlateParams,
  type PlateResult,
  type ChargeParams,
  type ChargeResult,
} from './faraday';
export {
  UNITS,
  STORAGE_UNIT,
  toStorage,
  fromStorage,
  convert,
  displayUnit,
  unitInfo,
  unitsOf,
  isUnitId,
  formatNumber,
  formatQuantity,
  formatStoredQuantity,
  type Quantity,
  type UnitSystem,
  type UnitId,
  type UnitOf,
  type FormatOptions,
} from './units';
export {
  blockArea,
  plateWithHolesArea,
  cylinderArea,
  tubeArea,
  sphereArea,
  frustumArea,
  measureShape,
  partMassG,
  type Shape,
  type ShapeMeasure,
  type BlockInput,
  type PlateWithHolesInput,
  type HoleSet,
  type CylinderInput,
  type TubeInput,
  type SphereInput,
  type FrustumInput,
} from './area';
export { SUBSTRATES, getSubstrate, type SubstrateId } from './substrates';
export { StlParser, analyzeStl, type StlAnalysis, type StlOptions, type StlUnit } from './stl';
export type { Vec3 } from './stl-geometry';
export {
  makeBinaryStl,
  makeAsciiStl,
  binaryStlChunks,
  cubeMesh,
  cylinderMesh,
  uvSphereMesh,
  meshOf,
  type Mesh,
  type Triangle,
} from './stl-mesh';
export { parseFormula, molarMass, metalFraction, FormulaError, type ElementCounts } from '../chemistry/formula';
export {
  DISTRIBUTION_RATIO_DEFAULTS,
  averageThicknessUm,
  planLoads,
  metalConsumed,
  saltForMetal,
  energyKWh,
  type Loading,
  type LoadPlan,
  type LoadPlanInput,
  type MetalUse,
  type MetalUseInput,
  type EnergyInput,
} from './practice';
export {
  estimateJob,
  ESTIMATE_CAUTION,
  type JobInput,
  type JobProcess,
  type JobFigures,
  type JobEstimate,
} from './estimate-job';
export { galvanicCheck, contactCheck, getGalvanicMaterial, type CoatingCheck, type ContactCheck } from './galvanic';
export {
  GALVANIC_MATERIALS,
  STANDARD_POTENTIALS,
  STANDARD_POTENTIAL_SOURCE,
  CONTACT_LIMITS_V,
  type GalvanicMaterial,
  type ServiceEnvironment,
} from './galvanic-data';
export { ANODIZE_720_CONSTANT, anodizeCalc, anodizeThicknessFromTime, anodizeDimensionChange, requireGrowthFraction, type AnodizeInput, type AnodizeResult } from './anodize';
export {
  EN_DENSITY_BY_PHOSPHORUS,
  densityForPhosphorus,
  electrolessCalc,
  metalTurnoversFromReplenishment,
  type ElectrolessInput,
  type ElectrolessResult,
} from './electroless';
export {
  CORROSIVITY_CATEGORIES,
  ZINC_LOSS_UM_PER_YEAR,
  ZINC_LIFE_STANDARD,
  describeZincLife,
  isCorrosivityCategory,
  zincServiceLife,
  zincThicknessForLife,
  type CorrosivityCategory,
  type ZincLife,
} from './zinc-life';
export {
  DEFAULT_PASSIVATION_WINDOWS,
  checkPassivation,
  type PassivationLot,
  type PassivationVerdict,
  type PassivationWindow,
  type TemperatureBand,
} from './passivation';
