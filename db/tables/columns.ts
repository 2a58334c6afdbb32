import type { ColumnType } from "kysely";

// Column types shared by every area's tables. `timestamptz` comes back as a Date; inserts and
// updates may pass a Date or an ISO string, and a column with a default may be left out.
export type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
