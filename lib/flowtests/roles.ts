/** Who may do what with flow tests (the guard runs on the server for every request). */
import { EVERYONE, LEADS, SHOP_FLOOR } from "../auth/roles";

/** Porter and machinist record tests; lead and admin too. */
export const FLOW_RECORDERS = SHOP_FLOOR;
/** Changing or deleting a recorded test is a lead's call, and leaves an audit event. */
export const FLOW_EDITORS = LEADS;
/** Everyone reads, the auditor included. */
export const FLOW_READERS = EVERYONE;
