package halfrail.units;

import java.util.Optional;

/**
 * The IEC 60062 tolerance letters printed on resistors and capacitors. F, G, J, K and M are
 * checked against IEC 60062; the others are given from memory.
 *
 * <p>From memory: for capacitors below 10 pF the letters B, C, D, F and G are read as absolute
 * tolerances in picofarads (±0.1, ±0.25, ±0.5, ±1, ±2 pF) rather than percentages; this enum
 * gives only the percentage meaning.
 */
public enum ToleranceCode {
    /** ±0.01 % (from memory). */
    L('L', 0.01, 0.01),
    /** ±0.05 % (from memory). */
    W('W', 0.05, 0.05),
    /** ±0.1 % (from memory). */
    B('B', 0.1, 0.1),
    /** ±0.25 % (from memory). */
    C('C', 0.25, 0.25),
    /** ±0.5 % (from memory). */
    D('D', 0.5, 0.5),
    /** ±1 %. */
    F('F', 1, 1),
    /** ±2 %. */
    G('G', 2, 2),
    /** ±5 %. */
    J('J', 5, 5),
    /** ±10 %. */
    K('K', 10, 10),
    /** ±20 %. */
    M('M', 20, 20),
    /** ±30 % (from memory). */
    N('N', 30, 30),
    /** −20 % / +50 % (from memory). */
    S('S', 20, 50),
    /** −20 % / +80 %, usual for high-permittivity ceramic capacitors (from memory). */
    Z('Z', 20, 80);

    /** Two percentages closer than this count as equal in {@link #forPercent(double)}. */
    public static final double PERCENT_MATCH_TOLERANCE = 1e-9;

    private final char letter;
    private final double minusPercent;
    private final double plusPercent;

    ToleranceCode(char letter, double minusPercent, double plusPercent) {
        this.letter = letter;
        this.minusPercent = minusPercent;
        this.plusPercent = plusPercent;
    }

    /** The letter printed on the part (upper case). */
    public char letter() {
        return letter;
    }

    /** How far below nominal a part may be, in percent, as a positive number (20 for M). */
    public double minusPercent() {
        return minusPercent;
    }

    /** How far above nominal a part may be, in percent (20 for M, 80 for Z). */
    public double plusPercent() {
        return plusPercent;
    }

    /** Whether the tolerance is the same both ways (all but S and Z). */
    public boolean isSymmetric() {
        return minusPercent == plusPercent;
    }

    /**
     * The code printed as {@code letter}, ignoring case.
     *
     * @return the code, or empty if the letter is not one of this enum's
     */
    public static Optional<ToleranceCode> forLetter(char letter) {
        char upper = Character.toUpperCase(letter);
        for (ToleranceCode code : values()) {
            if (code.letter == upper) {
                return Optional.of(code);
            }
        }
        return Optional.empty();
    }

    /**
     * The symmetric code for ±{@code percent} %, e.g. 5 → J.
     *
     * @param percent the tolerance in percent, positive
     * @return the code, or empty if no symmetric code has exactly that tolerance
     */
    public static Optional<ToleranceCode> forPercent(double percent) {
        for (ToleranceCode code : values()) {
            if (code.isSymmetric() && Math.abs(code.minusPercent - percent) <= PERCENT_MATCH_TOLERANCE) {
                return Optional.of(code);
            }
        }
        return Optional.empty();
    }
}
