import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

// Projects keep fast pure tests apart from the ones that need the running services.
// The access matrices live beside the code they check but run with the hostile suite.
// The fault drills restart PostgreSQL and Redis, so they run only from their own script
// (npm run test:faults sets SAGLINE_FAULTS=1), never inside npm test's shared services.
const faultDrills = process.env.SAGLINE_FAULTS === "1";
const accessMatrices = ["tests/integration/auth/access-matrix.test.ts", "tests/integration/api/v1/api-access-matrix.test.ts"];
export default defineConfig({
  resolve: { alias: { "@": fileURLToPath(new URL("./", import.meta.url)) } },
  test: {
    projects: [
      { extends: true, test: { name: "unit", include: ["tests/unit/**/*.test.ts"] } },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts", "tests/contract/**/*.test.ts"],
          exclude: accessMatrices,
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
          setupFiles: ["tests/helpers/integration-setup.ts"],
        },
      },
      {
        // Hostile input, stalls and access (npm run test:hostile); every file under tests/hostile/ belongs here.
        extends: true,
        test: {
          name: "hostile",
          include: ["tests/hostile/**/*.test.ts", "tests/hostile/**/*.spec.ts", ...accessMatrices],
          setupFiles: ["tests/helpers/integration-setup.ts"],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
      ...(faultDrills
        ? [
            {
              // Fault drills against real processes (npm run test:faults, docker-local/test-faults.sh).
              extends: true as const,
              test: {
                name: "faults",
                include: ["tests/faults/**/*.test.ts"],
                setupFiles: ["tests/helpers/integration-setup.ts"],
                testTimeout: 600_000,
                hookTimeout: 180_000,
                fileParallelism: false,
              },
            },
          ]
        : []),
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.spec.ts"],
          setupFiles: ["tests/helpers/integration-setup.ts"],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
