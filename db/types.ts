import type { Kysely, Transaction } from "kysely";
import type { AuthTables } from "./tables/auth";
import type { CoreTables } from "./tables/core";
import type { DesignTables } from "./tables/designs";
import type { ExportTables } from "./tables/exports";
import type { FeCheckTables } from "./tables/fe-checks";
import type { LibraryTables } from "./tables/library";
import type { ReviewTables } from "./tables/reviews";

// The typed schema of the whole database. Each area keeps its tables' interfaces in
// db/tables/<area>.ts next to the migrations that create them; this interface joins them.
export interface Database
  extends CoreTables, DesignTables, AuthTables, LibraryTables, ReviewTables, ExportTables, FeCheckTables {}

/** The database or an open transaction: what a query or write that may join a transaction takes. */
export type Executor = Kysely<Database> | Transaction<Database>;
