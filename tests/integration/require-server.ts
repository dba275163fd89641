/*
 * Global setup of the integration project. These tests talk to a running server; without one they
 * would pass while testing no API, so a missing or malformed address stops the run with the reason.
 * scripts/test.sh starts the server and sets GYROLUX_TEST_BASE_URL.
 */
export default function requireServer(): void {
  const url = process.env.GYROLUX_TEST_BASE_URL;
  const hint =
    "The integration tests need the server that `npm test` starts (scripts/test.sh). " +
    "Run `npm test`, or `npm run test:unit` for the unit tests alone.";
  if (!url) throw new Error(`GYROLUX_TEST_BASE_URL is not set. ${hint}`);
  if (!URL.canParse(url)) throw new Error(`GYROLUX_TEST_BASE_URL is not a URL: "${url}". ${hint}`);
}
