// Prints api-schemas/v1/problem.schema.json from the error-code table (see buildProblemSchema).
import { buildProblemSchema } from "./problem-types";

process.stdout.write(`${JSON.stringify(buildProblemSchema(), null, 2)}\n`);
