// Load the full unit engine (mathjs) before any test parses a unit.
import { loadUnitEngine } from '../src/lib/units/parse';
await loadUnitEngine();
