// Global setup of the API and browser projects: the server is started once by
// scripts/test.sh (npm test) and named by PLUMBLINE_TEST_URL.
export default async function setup() {
  const url = process.env.PLUMBLINE_TEST_URL
  if (!url) {
    throw new Error('PLUMBLINE_TEST_URL is not set: run these projects through `npm test` (scripts/test.sh), which builds and starts the server against the test MariaDB.')
  }
  const res = await fetch(`${url}/api/health`).catch(() => null)
  if (!res?.ok) throw new Error(`The test server at ${url} does not answer /api/health.`)
}
