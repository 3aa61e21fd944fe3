package halfrail.convert;

import java.util.OptionalDouble;

/**
 * One point of the lower-corner against settle-up trade-off: the converted design with its
 * coupling, leg and reference capacitors chosen for one target corner, analysed by the engine.
 *
 * @param targetCornerHz   the chain corner the capacitors were chosen for, Hz
 * @param capacitanceScale the capacitors' size relative to the converted design's (1 for the design itself)
 * @param lowerCornerHz    the chain's real lower −3 dB point from the engine, Hz (empty: none in range)
 * @param settleSeconds    the settle-up time from the engine's power-on transient, s (empty: not settled in the run)
 * @param simulatedSeconds how long the power-on run went, s (a lower bound on the settle-up time when not settled)
 * @param meetsBand        whether the lower corner lies at or below the band's low end
 * @param meetsSettle      whether the settle-up time lies within the limit (true when there is no limit)
 */
public record TradeOffPoint(double targetCornerHz, double capacitanceScale, OptionalDouble lowerCornerHz,
                            OptionalDouble settleSeconds, double simulatedSeconds, boolean meetsBand,
                            boolean meetsSettle) {
}
