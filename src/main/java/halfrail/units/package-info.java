/**
 * Engineering values and preferred numbers: reading and writing values such as 4.7 kΩ or the
 * IEC 60062 code 4K7 ({@link halfrail.units.EngineeringValue}), the IEC 60063 E-series
 * ({@link halfrail.units.ESeries}) and the IEC 60062 tolerance letters
 * ({@link halfrail.units.ToleranceCode}). Pure Java; depends on no other Halfrail package.
 */
package halfrail.units;
