// The typed outputs of a Sift run as the runner stores them (RunOutput in @cribra/contracts is their
// loose JSON form). Defined by @cribra/lang; re-exported here so the web has one place to import from.
export type {
  Binding,
  ChartOutput,
  SiftOutput,
  TableOutput,
  TextOutput,
  ValueJson,
  ValueOutput,
  VerdictOutput,
} from '@cribra/lang';
