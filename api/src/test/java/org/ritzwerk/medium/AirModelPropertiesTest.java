package org.ritzwerk.medium;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;

import org.junit.jupiter.api.Test;
import org.quicktheories.core.Gen;

/**
 * Invariants of the refractive-index models on seeded random inputs (QuickTheories): normal
 * dispersion, monotone conversions, the dependence on pressure and temperature, round trips.
 * All are facts of the trade (common practice), not values of one source.
 */
class AirModelPropertiesTest {

    private static final long SEED = 1996L;

    private static Gen<Ciddor1996> ciddorConditions() {
        return doubles().between(-40, 100).zip(doubles().between(10_000, 140_000), doubles().between(0, 100),
                doubles().between(0, 2000), Ciddor1996::new);
    }

    @Test
    void indexFallsWithWavelengthAndAirWavelengthRises() {
        qt().withFixedSeed(SEED).forAll(doubles().between(300e-9, 1688e-9), doubles().between(1e-12, 1e-9),
                ciddorConditions()).checkAssert((lambda, step, ciddor) -> {
                    for (AirModel model : new AirModel[] {StandardAir.INSTANCE, ciddor}) {
                        assertTrue(model.refractiveIndex(lambda) > model.refractiveIndex(lambda + step),
                                model::spec);
                        Medium air = Medium.air(model);
                        assertTrue(air.fromVacuum(lambda) < air.fromVacuum(lambda + step), model::spec);
                        assertTrue(model.refractiveIndex(lambda) > 1, model::spec);
                    }
                });
    }

    @Test
    void indexRisesWithPressureAndFallsWithTemperatureInDryAir() {
        qt().withFixedSeed(SEED).forAll(doubles().between(-39, 99), doubles().between(11_000, 139_000),
                doubles().between(300e-9, 1690e-9)).checkAssert((celsius, pascal, lambda) -> {
                    double n = new Ciddor1996(celsius, pascal, 0, 450).refractiveIndex(lambda);
                    assertTrue(new Ciddor1996(celsius, pascal + 500, 0, 450).refractiveIndex(lambda) > n);
                    assertTrue(new Ciddor1996(celsius + 0.5, pascal, 0, 450).refractiveIndex(lambda) < n);
                });
    }

    @Test
    void airToVacuumInvertsVacuumToAirTo1e12() {
        qt().withFixedSeed(SEED).forAll(doubles().between(300e-9, 1690e-9), ciddorConditions())
                .checkAssert((lambda, ciddor) -> {
                    for (Medium air : new Medium[] {Medium.air(), Medium.air(ciddor)}) {
                        double back = air.toVacuum(air.fromVacuum(lambda));
                        assertEquals(lambda, back, 1e-12 * lambda, air::spec);
                    }
                });
    }

    @Test
    void modelSpecsReadBackToEqualModels() {
        qt().withFixedSeed(SEED).forAll(ciddorConditions()).checkAssert(ciddor ->
                assertEquals(ciddor, AirModels.parse(ciddor.spec())));
        assertEquals(StandardAir.INSTANCE, AirModels.parse("standard"));
        assertEquals(Ciddor1996.STANDARD_AIR, AirModels.parse("ciddor1996"));
        assertEquals(new Ciddor1996(20, 101_325, 40, 450),
                AirModels.parse("ciddor1996:T=293.15K,p=101.325kPa,RH=40%,CO2=450ppm"));
    }
}
