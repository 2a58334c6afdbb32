import type { CoreTables } from "./tables/core";
import type { DesignTables } from "./tables/designs";
import type { LibraryTables } from "./tables/library";

// The typed schema of the whole database. Each area keeps its tables' interfaces in
// db/tables/<area>.ts next to the migrations that create them; this interface joins them.
export interface Database extends CoreTables, DesignTables, LibraryTables {}
