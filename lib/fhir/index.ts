/** FHIR R4 import of HbA1c and fasting glucose Observations for the glucose history. */
export * from './loinc';
export * from './observation';
export * from './importGlucose';
export * from './summary';
