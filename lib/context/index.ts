/** Who a scenario's figures are about and where they come from, once (./scenarioContext.ts). */
export * from './scenarioContext';
