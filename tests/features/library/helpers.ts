import { createTaggedOrg, dropTaggedOrg, orgForSuite } from "../../setup/suite-org";

/** An organisation with an admin (also a designer) and a designer. */
export async function createOrgWithUsers(label: string) {
  const { organizationId, tag, person } = await createTaggedOrg(label);
  return {
    organizationId,
    slug: tag,
    adminId: (await person("admin", ["admin", "designer"])).userId,
    designerId: (await person("designer", ["designer"])).userId,
  };
}

/** createOrgWithUsers for the whole file (or describe block): made before its tests, dropped after them. */
export const orgWithUsersForSuite = (label: string) => orgForSuite(() => createOrgWithUsers(label));

/** Removes a suite's organisation (tests/setup/suite-org.ts). */
export const dropOrg = dropTaggedOrg;
