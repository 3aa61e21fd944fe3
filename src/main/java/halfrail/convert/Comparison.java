package halfrail.convert;

/**
 * Before and after: the dual-rail original and the single-supply conversion side by side.
 *
 * @param before the original on its ± supply
 * @param after  the conversion on its single supply
 */
public record Comparison(ChainFigures before, ChainFigures after) {
}
