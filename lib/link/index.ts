/** The scenario link codec: a scenario as a URL fragment and back. See ./scenarioLink.ts. */
export {
  decodeScenarioQuery,
  encodeScenarioLink,
  hasLoneSurrogate,
  LINK_PARAMS,
  MAX_LINK_CHARS,
  readScenarioLink,
  scenarioFragment,
  scenarioLinkIssues,
  scenarioQuery,
  type LinkReading,
} from './scenarioLink';
