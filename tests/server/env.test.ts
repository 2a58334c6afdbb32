import { describe, expect, it } from "vitest";
import { ConfigurationError, parseEnv } from "@/server/env";

const valid = {
  DATABASE_URL: "postgres://u:p@127.0.0.1:5432/db",
  APP_URL: "http://127.0.0.1:3000",
  SMTP_HOST: "127.0.0.1",
  SMTP_PORT: "2525",
};

describe("server settings", () => {
  it("parses a complete configuration and applies defaults", () => {
    const env = parseEnv(valid);
    expect(env.SMTP_PORT).toBe(2525);
    expect(env.SMTP_SECURE).toBe(false);
    expect(env.DATABASE_POOL_MAX).toBe(10);
    expect(env.WEB_WORKERS).toBeUndefined();
  });

  it("reads WEB_WORKERS (the web launcher's processes) as a count from 1 to 64", () => {
    expect(parseEnv({ ...valid, WEB_WORKERS: "2" }).WEB_WORKERS).toBe(2);
    expect(() => parseEnv({ ...valid, WEB_WORKERS: "0" })).toThrow(/WEB_WORKERS/);
  });

  it("lists every missing or bad variable in one message", () => {
    let message = "";
    try {
      parseEnv({ APP_URL: "not a url", SMTP_PORT: "seventy" });
    } catch (error) {
      expect(error).toBeInstanceOf(ConfigurationError);
      message = (error as Error).message;
    }
    expect(message).toMatch(/DATABASE_URL is missing/);
    expect(message).toMatch(/APP_URL must be the public origin/);
    expect(message).toMatch(/SMTP_HOST is missing/);
    expect(message).toMatch(/SMTP_PORT/);
    expect(message.split("\n")).toHaveLength(1);
  });

  it("rejects a database URL that is not PostgreSQL", () => {
    expect(() => parseEnv({ ...valid, DATABASE_URL: "mysql://x" })).toThrow(
      /DATABASE_URL must be a postgres/,
    );
  });
});
