// Unit and integration tests never touch the demo database: each test file that needs a
// database creates its own temporary one (see tests/helpers/db.ts).
process.env.AUTH_SECRET ??= "test-secret-test-secret-test-secret-0000";
process.env.APP_URL ??= "http://localhost:3000";
