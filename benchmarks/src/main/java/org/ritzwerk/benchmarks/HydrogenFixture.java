package org.ritzwerk.benchmarks;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;

/** What the hydrogen benchmarks share: the model and the object-per-level baseline. */
final class HydrogenFixture {

    private HydrogenFixture() {
    }

    /** One level as an object, for the baselines. */
    record Level(int n, int l, int twoJ, double energy) {
    }

    /** @return hydrogen in the QED tier, proton data from CODATA 2018 */
    static HydrogenLikeModel hydrogen() {
        Nucleus proton = new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1, OptionalDouble.of(2.79284734463),
                OptionalDouble.of(0.8414e-15), "CODATA 2018");
        return HydrogenLikeModel.of(proton, Tier.QED);
    }

    /** @return every level n l j up to nMax, one object each (the naive baseline) */
    static List<Level> objectLevels(HydrogenLikeModel model, int nMax) {
        List<Level> levels = new ArrayList<>();
        for (int n = 1; n <= nMax; n++) {
            for (int l = 0; l < n; l++) {
                for (int twoJ = Math.max(2 * l - 1, 1); twoJ <= 2 * l + 1; twoJ += 2) {
                    levels.add(new Level(n, l, twoJ, model.energy(n, l, twoJ)));
                }
            }
        }
        return levels;
    }
}
