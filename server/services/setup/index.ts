// The Setup area's operations: products and characteristics, limit revisions, stations.
export { listProducts, getProduct, createProduct, updateProduct } from './products.js';
export { listCharacteristics, createCharacteristic, updateCharacteristic } from './characteristics.js';
export { productHipotVoltage } from './product-hipot.js';
export { listLimitSets, getLimitSet } from './limit-set-queries.js';
export { findLimitSetInForce } from './limit-set-rows.js';
export { createLimitDraft, replaceDraftLimits, discardLimitDraft } from './limit-drafts.js';
export { approveLimitSet, retireLimitSet } from './limit-approval.js';
export { limitSetDifference } from './limit-difference.js';
export { listStations, createStation, updateStation, calibrationStateOf } from './stations.js';
export { listCalibrations, recordCalibration } from './calibrations.js';
export { listStationClients, bindStationClient, unbindStationClient } from './station-clients.js';
