// Field-check records: the selections open to a workspace for field checks, recording a check
// (or an amendment: a new version of its chain) with its photos, exactly once per device-made id,
// reading checks back, and the engineer's notice by e-mail. The check itself is worked out by the
// pure `evaluate.ts` (which the phone also runs offline).
//
// Who sees what: a selection is open for field checks to its own workspace and to every workspace
// its project is shared with and whose admins accepted the share (`openShareTo`: a pending or declined
// share opens nothing); its checks are open to the same workspaces. Ids from elsewhere
// answer 404, never data. A check is never edited: an amendment is a new version of its chain.
// One concept a file, this the face: access.server.ts (who sees which selection), lists.server.ts (the lists of checks),
// one-check.server.ts (one check's record), recording.server.ts (recording once per device id, the e-mail).
export { fieldSelection, fieldSelectionRecord } from "./access.server";
export { checkHistory, checkRecords, checksOf, fieldHome, type CheckHistory, type ListedCheck } from "./lists.server";
export { getFieldCheck } from "./one-check.server";
export { CheckConflict, CLIENT_ID, recordFieldCheck, type NewCheck } from "./recording.server";
