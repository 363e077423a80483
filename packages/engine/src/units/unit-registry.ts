/**
 * The engine's own mathjs unit instance with the trade units defined on it.
 *
 * Isolated (`create` with only the unit factories) so nothing here can reach
 * `evaluate` and no other package's unit definitions leak in. Only
 * `unit()` parsing is used; text from files is never evaluated.
 */
import { create, createUnitDependencies, type Unit, unitDependencies } from 'mathjs';

export const math = create({ unitDependencies, createUnitDependencies });

// Inch of mercury, conventional (32 F): NIST SP 811 (2008), appendix B.8.
math.createUnit('inHg', { definition: '3386.389 Pa' });
// Inch of water at 39.2 F: NIST SP 811 (2008), appendix B.8.
math.createUnit('inH2O', { definition: '249.082 Pa' });
// Feet per minute, the trade's velocity unit: 1 ft = 0.3048 m exactly (NIST SP 811).
math.createUnit('fpm', { definition: '1 ft/min' });
// Cubic feet per minute (basis is tracked separately, see flow-units.ts).
math.createUnit('cfm', { definition: '1 ft^3/min' });
// mathjs already has mmH2O (9.80665 Pa, conventional, NIST SP 811), mbar, sqft, um, hp (745.7 W), degF.

export type MathUnit = Unit;

/** Parse a unit expression with mathjs (value 1 unless given), or undefined when mathjs does not know it. */
export function parseUnit(expression: string, value = 1): MathUnit | undefined {
  try {
    return math.unit(value, expression);
  } catch {
    return undefined;
  }
}
