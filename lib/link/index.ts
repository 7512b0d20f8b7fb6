/** The scenario link codec: a scenario as a URL query and back. See ./scenarioLink.ts. */
export { decodeScenarioQuery, encodeScenarioLink, LINK_PARAMS, scenarioQuery } from './scenarioLink';
