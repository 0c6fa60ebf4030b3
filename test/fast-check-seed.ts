// Property tests draw the same cases on every run, so the gate does not pass or fail by chance; a
// failure prints its seed and path and reproduces. To explore new cases set FC_SEED to any integer
// (e.g. FC_SEED=$RANDOM npx vitest run) and keep a case that fails as an explicit example.
import fc from 'fast-check';

fc.configureGlobal({ seed: Number(process.env['FC_SEED'] ?? 20261201) });
