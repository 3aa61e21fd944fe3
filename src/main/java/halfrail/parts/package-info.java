/**
 * Parts data: capacitor technologies, op-amp archetypes, cell chemistries and supply
 * standards, shipped as JSON resources under {@code halfrail/parts/} and read by
 * {@link halfrail.parts.PartsLibrary#builtIn()}. No circuit solving happens here — only the
 * data and the simple per-part formulas (leakage limit, derating, discharge-curve lookup).
 *
 * <h2>Resource format</h2>
 * Every resource is one object: {@code {"formatVersion": 1, "about": "…", "entries": [ … ]}}.
 * Each entry is one record of this package, its fields named as the record components and
 * given in SI units (F, V, A, Ω, s, Hz, V/s). Loading is strict: an unknown, missing or null
 * field, a number written as text, a duplicate key, a duplicate id or a value out of range
 * fails with a {@link halfrail.parts.PartsException} of kind {@code BAD_DATA} that names the
 * resource and the JSON path ({@code $.entries[2].leakage.floorAmps}).
 *
 * <h2>Where the figures come from</h2>
 * Each entry carries a {@code basis} map from field to source: a standard (IEC 60384-4,
 * IEC 60384-1, IEC 60086-2, USB 2.0 §7.2 …), "common practice" for a figure of the trade with
 * no standard behind it, and "from memory" where a value is remembered rather than looked up.
 * Op-amp archetypes are representative figures for a class of part, not any one part.
 *
 * <h2>Safety</h2>
 * Cell figures are planning values; the cell maker's data governs. Lithium cells need a
 * protection circuit and must be charged and discharged only within the cell maker's limits;
 * follow local regulations. Mains adapters need their own certification and licensed practice.
 */
package halfrail.parts;
