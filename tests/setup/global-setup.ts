// Runs once before the vitest suites. scripts/test.sh has already started a throw-away
// PostgreSQL and created and migrated the test database; here we only make sure nobody points
// the suites at the demo data by mistake.
export default function setup(): void {
  const url = process.env.DATABASE_URL;
  if (url && !/sealpitch_test/.test(url)) {
    throw new Error(
      `Refusing to run tests against ${url}: the test database name must contain "sealpitch_test".`,
    );
  }
}
