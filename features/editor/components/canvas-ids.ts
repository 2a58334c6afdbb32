// Ids of Konva nodes that tests and the review screen look up (stage.findOne("#…")).
export const sanitizeId = (raw: string): string => raw.replace(/[^A-Za-z0-9_-]/g, "-");
export const boltNodeId = (boltId: string): string => `bolt-${sanitizeId(boltId)}`;
export const violationNodeId = (checkId: string, index = 0): string =>
  `violation-${sanitizeId(checkId)}${index ? `-${index}` : ""}`;
