/** Runs the engine benchmark alone in this process and prints its result as JSON (used by run.ts). */
import { benchEngine } from './engine';

const seconds = Number(process.argv[2] ?? 6);
process.stdout.write(JSON.stringify(benchEngine(seconds)) + '\n');
