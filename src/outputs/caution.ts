// The caution every report carries, with the NFPA 13 edition its limits follow.

import { EDITION } from '../basis/limits.js';

export const CAUTION =
  'headcheck is a screening aid for plan reviewers and designers, not a substitute for a licensed fire-protection ' +
  'engineer or the authority having jurisdiction. Its limits follow ' +
  EDITION +
  '; the locally adopted code, ' +
  "the heads' listings and the insurer's rules prevail and must be checked.";
