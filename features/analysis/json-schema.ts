/**
 * JSON Schema of the joint design document, published for API clients and the CLI. The geometric
 * refinements (bolt holes inside the outline and so on) cannot be expressed in JSON Schema; they
 * are enforced by `jointDesignSchema` on the server.
 */
import { z } from "zod";
import { jointDesignBaseSchema } from "./schema";

export function getDesignJsonSchema(): Record<string, unknown> {
  return z.toJSONSchema(jointDesignBaseSchema, { target: "draft-2020-12" }) as Record<string, unknown>;
}
