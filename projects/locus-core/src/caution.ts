/**
 * The caution that accompanies every stability statement and every suggested gain.
 */
export const CAUTION =
  'Model-based result: it is only as good as the plant model. Verify any gain on the real plant with ' +
  'limits and protective interlocks in place, raise it gradually, and defer to local codes, the ' +
  'equipment maker and licensed engineering practice.';
