package org.ritzwerk.engine.synth;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.IntPredicate;

/**
 * The lines of a scene that lie on its pixel grid (centre between the grid's lowest and highest
 * edge, ends included) but carry no light into the spectrum, each with its index, label, position
 * and {@link Cause}, and how many lines lie on the grid at all. One classification for every
 * caller: {@link Scene#darkLines()} (before rendering), {@link SyntheticSpectrum#darkLines()}
 * (after it) and {@link SceneException#darkLines()} (the scene {@link Scene#render} refused
 * because nothing on the grid gives light) all make it here.
 *
 * <p>The cause of a dark line is told by where its photon rate came from
 * ({@link Scene.Lines#intensityGiven}) and whether it is 0:
 * <ul>
 * <li>{@link Cause#ZERO_INTENSITY}: a line list gave it intensity 0, or one so small beside the
 * list's strongest line that scaling the list to the one-electron ions' reference rate made its
 * photon rate 0 (the two cannot be told apart after the scaling);</li>
 * <li>{@link Cause#INTENSITY_UNDERFLOW}: a line list gave it a photon rate above 0, but scaled so
 * that the brightest pixel expects the scene's peak counts, its counts are below the smallest
 * positive double (about 4.9e-324), or its light vanished in rendering;</li>
 * <li>{@link Cause#POPULATION_UNDERFLOW}: the scene computed its photon rate (Boltzmann
 * population exp(-E / kT), Saha balance, abundance) and that rate, or the counts it gives once
 * scaled, is below the smallest positive double: too cold, or the ionisation balance leaves no
 * emitters. Lines made by {@link Scene.Lines#of} (read back from a file) do not say whether their
 * rates were given, so their dark lines have this cause.</li>
 * </ul>
 *
 * <p>The lines are in index order. Immutable, thread-safe and {@link Serializable} (it travels in
 * a {@link SceneException}).
 *
 * <p>The serialised form is not part of the API.
 *
 * @param onGrid the number of the scene's lines whose centre lies on the grid, dark or not
 * @param lines  the dark ones among them, in index order (a copy is kept)
 * @serial exclude
 */
public record DarkLines(int onGrid, List<Line> lines) implements Serializable {

    private static final long serialVersionUID = 1L;

    /** Why a line on the grid carries no light; see {@link DarkLines}. */
    public enum Cause {
        /** A line list gave it intensity 0, or one that became 0 when the list was scaled to the ions. */
        ZERO_INTENSITY,
        /** A line list gave it a rate above 0, but its scaled counts are below the smallest double. */
        INTENSITY_UNDERFLOW,
        /** The scene computed its rate (Boltzmann, Saha), and the rate or its scaled counts underflow. */
        POPULATION_UNDERFLOW
    }

    /**
     * One dark line.
     *
     * @param index      the line's index in the scene's {@link Scene.Lines}
     * @param label      its label, as {@link Scene.Lines#label}
     * @param positionNm its centre in nm, in the axis medium, Doppler-shifted
     * @param cause      why it carries no light
     * @serial exclude
     */
    public record Line(int index, String label, double positionNm, Cause cause) implements Serializable {
        private static final long serialVersionUID = 1L;

        /**
         * Checks the components.
         *
         * @param index      the line's index in the scene's lines, 0 or more
         * @param label      its label, not null
         * @param positionNm its centre in nm
         * @param cause      why it carries no light, not null
         * @throws NullPointerException     when the label or cause is null
         * @throws IllegalArgumentException when the index is negative
         */
        public Line {
            Objects.requireNonNull(label, "label");
            Objects.requireNonNull(cause, "cause");
            if (index < 0) {
                throw new IllegalArgumentException("a line's index must be 0 or more, got " + index);
            }
        }
    }

    /**
     * Checks the components and copies the list.
     *
     * @param onGrid the number of the scene's lines on the grid, at least the number of dark ones
     * @param lines  the dark ones, not null
     * @throws NullPointerException     when the list or one of its lines is null
     * @throws IllegalArgumentException when onGrid is negative or below the number of dark lines
     */
    public DarkLines {
        lines = List.copyOf(lines);
        if (onGrid < lines.size()) {
            throw new IllegalArgumentException("the lines on the grid (" + onGrid + ") cannot be fewer than the dark"
                    + " ones (" + lines.size() + ")");
        }
    }

    /** @return whether every line on the grid carries light (or none lies there) */
    public boolean isEmpty() {
        return lines.isEmpty();
    }

    /** @return the number of dark lines */
    public int size() {
        return lines.size();
    }

    /**
     * @param cause a cause
     * @return the number of dark lines with that cause
     */
    public int count(Cause cause) {
        Objects.requireNonNull(cause, "cause");
        int n = 0;
        for (Line line : lines) {
            n += line.cause() == cause ? 1 : 0;
        }
        return n;
    }

    /**
     * @param cause a cause
     * @return the dark lines with that cause, in index order
     */
    public List<Line> withCause(Cause cause) {
        Objects.requireNonNull(cause, "cause");
        List<Line> out = new ArrayList<>();
        for (Line line : lines) {
            if (line.cause() == cause) {
                out.add(line);
            }
        }
        return List.copyOf(out);
    }

    /**
     * The classification itself: every line on the grid for which {@code dark} holds, with its cause.
     *
     * @param lines the scene's lines
     * @param grid  the pixels
     * @param dark  whether line i (on the grid) carries no light
     */
    static DarkLines find(Scene.Lines lines, PixelGrid grid, IntPredicate dark) {
        double lo = grid.lowest();
        double hi = grid.highest();
        int onGrid = 0;
        List<Line> found = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            double at = lines.position(i);
            if (!(at >= lo && at <= hi)) {
                continue;
            }
            onGrid++;
            if (dark.test(i)) {
                Cause cause = !lines.intensityGiven(i) ? Cause.POPULATION_UNDERFLOW
                        : lines.photons(i) == 0 ? Cause.ZERO_INTENSITY : Cause.INTENSITY_UNDERFLOW;
                found.add(new Line(i, lines.label(i), at, cause));
            }
        }
        return new DarkLines(onGrid, found);
    }
}
