package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.integers;
import static org.quicktheories.generators.SourceDSL.longs;

import java.util.DoubleSummaryStatistics;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.quicktheories.core.Gen;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.MeasuredLevel;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.pair.PairState;
import org.ritzwerk.engine.rydberg.DecayChannel;
import org.ritzwerk.engine.rydberg.Level;
import org.ritzwerk.engine.rydberg.LevelOrigin;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.medium.AirModel;
import org.ritzwerk.medium.Ciddor1996;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.StandardAir;
import org.ritzwerk.quantity.Energy;
import org.ritzwerk.quantity.Frequency;
import org.ritzwerk.quantity.Quantity;
import org.ritzwerk.quantity.SpectralQuantity;
import org.ritzwerk.quantity.Target;
import org.ritzwerk.quantity.Temperature;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;
import org.ritzwerk.quantity.Wavenumber;
import tools.jackson.core.JacksonException;
import tools.jackson.core.type.TypeReference;
import tools.jackson.core.json.JsonReadFeature;
import tools.jackson.databind.DatabindException;
import tools.jackson.databind.DefaultTyping;
import tools.jackson.databind.jsontype.BasicPolymorphicTypeValidator;
import tools.jackson.databind.jsontype.PolymorphicTypeValidator;
import tools.jackson.databind.json.JsonMapper;

/**
 * The Jackson module: every value type round-trips bit for bit over random values, the JSON text
 * of fixed examples stays as documented, and bad input is refused naming the field.
 */
class RitzwerkJacksonTest {

    private static final long SEED = 20261205L;

    private final JsonMapper json = JsonMapper.builder().addModule(RitzwerkJackson.module()).build();

    /** A user's own record holding the types, as a JVM project would write it. */
    public record Observation(String name, Species species, State upper, Wavelength line, SpectralQuantity position,
            Quantity any, Temperature temperature, Energy limit, Medium medium, AirModel model, Unit unit,
            Map<Species, Wavenumber> shifts, List<Frequency> frequencies) {
    }

    // ---- Without the module (the problem this module solves; kept so the motivation stays checked).

    @Test
    void withoutTheModuleAQuantityIsWrittenAsAnEmptyObject() {
        // Jackson's default bean serialiser finds no getters on the quantity classes.
        JsonMapper plain = JsonMapper.builder().build();
        assertEquals("{}", plain.writeValueAsString(Wavelength.ofMetres(6.5628e-7, Medium.air())));
        assertThrows(JacksonException.class, () -> plain.readValue("{}", Wavelength.class));
    }

    @Test
    void aRitzwerkResultWithoutAShapeIsRefusedInsteadOfWrittenAsAnEmptyObject() {
        PixelGrid grid = PixelGrid.linear(400, 700, 10);
        assertEquals("{}", JsonMapper.builder().build().writeValueAsString(grid));
        DatabindException e = assertThrows(DatabindException.class, () -> json.writeValueAsString(grid));
        assertTrue(e.getOriginalMessage().startsWith("org.ritzwerk.engine.synth.PixelGrid has no JSON shape (Jackson"
                + " would write {}): write it with its own file format"), e.getOriginalMessage());
        assertThrows(DatabindException.class, () -> json.writeValueAsString(new Holder(grid)));
        // A user's own empty class keeps Jackson's behaviour.
        assertEquals("{}", json.writeValueAsString(new Object()));
    }

    /**
     * A Ritzwerk record's "not estimated" NaN is written as null and read back as NaN, and a missing double
     * component is refused; Jackson alone writes "NaN" and reads a missing component as 0 (an uncertainty
     * of zero). Other classes keep Jackson's behaviour.
     */
    @Test
    void aNotEstimatedDoubleIsWrittenAsNullAndAMissingOneIsRefused() {
        Level none = new Level(State.parse("60s1/2"), 33690.9, 56.86, LevelOrigin.HYDROGENIC);
        String text = json.writeValueAsString(none);
        assertEquals("{\"state\":\"60s1/2\",\"energyPerCm\":33690.9,\"effectiveN\":56.86,\"origin\":\"HYDROGENIC\","
                + "\"uncertaintyPerCm\":null}", text);
        assertTrue(JsonMapper.builder().build().writeValueAsString(none).contains("\"NaN\""), "Jackson alone");
        Level back = json.readValue(text, Level.class);
        assertTrue(back.energyUncertaintyPerCm().isEmpty(), back.toString());
        assertEquals(none, back);
        Level stated = new Level(State.parse("5p3/2"), 12816.549389, 3.7, LevelOrigin.MEASURED, 3.7e-7);
        assertEquals(stated, json.readValue(json.writeValueAsString(stated), Level.class));
        String missing = "{\"state\":\"60s1/2\",\"energyPerCm\":33690.9,\"effectiveN\":56.86,"
                + "\"origin\":\"HYDROGENIC\"}";
        DatabindException e = assertThrows(DatabindException.class, () -> json.readValue(missing, Level.class));
        assertTrue(e.getOriginalMessage().contains("Level field \"uncertaintyPerCm\" is missing (write null for a "
                + "value that is not estimated)"), e.getOriginalMessage());
        // the record's own constructor still decides what it takes: a negative uncertainty is refused
        assertThrows(DatabindException.class, () -> json.readValue(missing.replace("}", ",\"uncertaintyPerCm\":-1}"),
                Level.class));
        // other classes keep Jackson's behaviour: a NaN written as "NaN", a null map value read as null
        DoubleSummaryStatistics stats = new DoubleSummaryStatistics();
        stats.accept(Double.NaN);
        assertTrue(json.writeValueAsString(stats).contains("\"sum\":\"NaN\""), json.writeValueAsString(stats));
        Map<String, Double> map = json.readValue("{\"a\":null,\"b\":2.5}", new TypeReference<Map<String, Double>>() {
        });
        assertTrue(map.containsKey("a") && map.get("a") == null && map.get("b") == 2.5, map.toString());
        assertEquals(2.5, json.readValue("2.5", Double.class));
    }

    // ---- Fixed examples: the documented shape, character for character. The expected texts are the
    // format RitzwerkJackson's Javadoc defines; the inputs are arbitrary, not physics.

    @Test
    void quantitiesAreWrittenInSiUnitsWithUncertaintyAndMedium() {
        assertEquals("{\"value\":6.5628E-7,\"unit\":\"m\",\"medium\":\"air\"}",
                json.writeValueAsString(Wavelength.ofMetres(6.5628e-7, Medium.air())));
        assertEquals("{\"value\":6.5628E-7,\"uncertainty\":1.0E-13,\"unit\":\"m\",\"medium\":\"vacuum\"}",
                json.writeValueAsString(Wavelength.of(6.5628e-7, 1e-13, Unit.METRE, Medium.vacuum())));
        assertEquals("{\"value\":5.0E-7,\"unit\":\"m\",\"medium\":"
                + "\"air(ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm)\"}",
                json.writeValueAsString(Wavelength.ofMetres(5e-7, Medium.air(new Ciddor1996(20, 101_325, 40, 450)))));
        // 656.28 nm is held as 656.28 / 1e9 m, the double below (Python: 656.28/1e9 = 6.562799999999999e-07).
        assertEquals("{\"value\":6.562799999999999E-7,\"unit\":\"m\",\"medium\":\"air\"}",
                json.writeValueAsString(Wavelength.ofNanometres(656.28, Medium.air())));
        // The README's example (section "JSON with Jackson").
        assertEquals("{\"value\":6.56279E-7,\"uncertainty\":2.0E-12,\"unit\":\"m\",\"medium\":\"air\"}",
                json.writeValueAsString(Wavelength.of(656.279, 0.002, Unit.NANOMETRE, Medium.air())));
        assertEquals("{\"value\":1523300.0,\"uncertainty\":2.5,\"unit\":\"m-1\"}",
                json.writeValueAsString(Wavenumber.of(1523300, 2.5, Unit.PER_METRE)));
        assertEquals("{\"value\":4.5668E14,\"unit\":\"Hz\"}", json.writeValueAsString(Frequency.ofHertz(4.5668e14)));
        assertEquals("{\"value\":-2.5E-19,\"unit\":\"J\"}", json.writeValueAsString(Energy.ofJoules(-2.5e-19)));
        assertEquals("{\"value\":5000.0,\"uncertainty\":20.0,\"unit\":\"K\"}",
                json.writeValueAsString(Temperature.of(5000, 20, Unit.KELVIN)));
    }

    @Test
    void textValuesAreWrittenInTheirNotation() {
        assertEquals("[\"He II\",\"Rb-87 I\",\"D I\"]", json.writeValueAsString(List.of(Species.parse("He+"),
                Species.parse("87Rb"), new Species(1, 2, 0))));
        assertEquals("[\"5s1/2\",\"43d5/2\",\"60(l=40)81/2\"]",
                json.writeValueAsString(List.of(State.of(5, 0, 1), State.of(43, 2, 5), State.of(60, 40, 81))));
        assertEquals("[\"vacuum\",\"air\",\"air(ciddor1996:T=15C,p=101325Pa,RH=0%,CO2=450ppm)\"]",
                json.writeValueAsString(List.of(Medium.vacuum(), Medium.air(), Medium.air(Ciddor1996.STANDARD_AIR))));
        assertEquals("[\"standard\",\"ciddor1996:T=15C,p=101325Pa,RH=0%,CO2=450ppm\"]",
                json.writeValueAsString(List.<AirModel>of(StandardAir.INSTANCE, Ciddor1996.STANDARD_AIR)));
        assertEquals("[\"nm\",\"\u00c5\",\"cm-1\"]",
                json.writeValueAsString(List.of(Unit.NANOMETRE, Unit.ANGSTROM, Unit.PER_CENTIMETRE)));
        Map<Species, Double> keys = new LinkedHashMap<>();
        keys.put(Species.parse("He II"), 1.0);
        assertEquals("{\"He II\":1.0}", json.writeValueAsString(keys));
    }

    @Test
    void readingTakesAnyUnitOfTheKindThroughTheFactory() {
        assertEquals(Wavelength.ofNanometres(656.28, Medium.air()),
                json.readValue("{\"value\":656.28,\"unit\":\"nm\",\"medium\":\"air\"}", Wavelength.class));
        assertEquals(Wavenumber.of(15233, 0.02, Unit.PER_CENTIMETRE),
                json.readValue("{\"unit\":\"cm^-1\",\"uncertainty\":0.02,\"value\":15233}", Wavenumber.class));
        assertEquals(Energy.ofElectronVolts(13.6), json.readValue("{\"value\":13.6,\"unit\":\"eV\"}", Energy.class));
        // A field typed SpectralQuantity or Quantity reads the type its unit names.
        assertEquals(Frequency.of(456.68, Unit.TERAHERTZ),
                json.readValue("{\"value\":456.68,\"unit\":\"THz\"}", SpectralQuantity.class));
        assertEquals(Temperature.ofKelvin(300), json.readValue("{\"value\":300,\"unit\":\"K\"}", Quantity.class));
        assertEquals(Species.parse("C VI"), json.readValue("\"C5+\"", Species.class));
        assertEquals(Unit.MICROMETRE, json.readValue("\"\u00b5m\"", Unit.class));
    }

    // ---- Round trips over random values: equal (exact equals: bits of value and uncertainty, medium).

    @Test
    void wavelengthsRoundTripInEveryMedium() {
        qt().withFixedSeed(SEED).withExamples(400).forAll(positiveDoubles(), uncertainties(), media())
                .checkAssert((metres, u, medium) -> {
                    Wavelength w = u < 0 ? Wavelength.ofMetres(metres, medium)
                            : Wavelength.of(metres, u, Unit.METRE, medium);
                    assertRoundTrip(w, Wavelength.class);
                });
    }

    @Test
    void otherQuantitiesRoundTripOverTheirWholeRange() {
        qt().withFixedSeed(SEED).withExamples(400).forAll(finiteDoubles(), uncertainties()).checkAssert((v, u) -> {
            assertRoundTrip(u < 0 ? Wavenumber.of(v, Unit.PER_METRE) : Wavenumber.of(v, u, Unit.PER_METRE),
                    Wavenumber.class);
            assertRoundTrip(u < 0 ? Energy.ofJoules(v) : Energy.of(v, u, Unit.JOULE), Energy.class);
        });
        qt().withFixedSeed(SEED).withExamples(400).forAll(positiveDoubles(), uncertainties()).checkAssert((v, u) -> {
            assertRoundTrip(u < 0 ? Frequency.ofHertz(v) : Frequency.of(v, u, Unit.HERTZ), Frequency.class);
            assertRoundTrip(u < 0 ? Temperature.ofKelvin(v) : Temperature.of(v, u, Unit.KELVIN), Temperature.class);
        });
        // Edge values tried explicitly: signed zeros, the extremes of the double range.
        for (double v : new double[] {0.0, -0.0, Double.MIN_VALUE, -Double.MIN_VALUE, Double.MAX_VALUE,
            -Double.MAX_VALUE, Double.MIN_NORMAL}) {
            assertRoundTrip(Energy.ofJoules(v), Energy.class);
            assertRoundTrip(Wavenumber.of(v, Double.MIN_VALUE, Unit.PER_METRE), Wavenumber.class);
        }
        assertRoundTrip(Temperature.ofKelvin(-0.0), Temperature.class);
        assertRoundTrip(Temperature.of(0.0, 0.0, Unit.KELVIN), Temperature.class);
        assertRoundTrip(Wavelength.of(Double.MAX_VALUE, Double.MAX_VALUE, Unit.METRE, Medium.vacuum()),
                Wavelength.class);
        assertRoundTrip(Frequency.ofHertz(Double.MIN_VALUE), Frequency.class);
    }

    @Test
    void convertedQuantitiesRoundTrip() {
        // Values that come out of conversions, not factories: uncertainties carried through media.
        qt().withFixedSeed(SEED).withExamples(200).forAll(doubles().between(300, 1690), doubles().between(0, 1e-3),
                media()).checkAssert((nm, u, medium) -> {
                    Wavelength w = Wavelength.of(nm, u, Unit.NANOMETRE, Medium.vacuum()).toWavelength(medium);
                    assertRoundTrip(w, Wavelength.class);
                    assertRoundTrip(w.toWavenumber(), Wavenumber.class);
                    assertRoundTrip(w.toFrequency(), Frequency.class);
                    assertRoundTrip(w.toEnergy(), Energy.class);
                    assertRoundTrip(w.toEnergy().toTemperature(), Temperature.class);
                });
    }

    @Test
    void speciesStatesMediaModelsAndUnitsRoundTrip() {
        qt().withFixedSeed(SEED).withExamples(500).forAll(integers().between(1, 118), integers().between(0, 1000),
                integers().between(0, 1000)).checkAssert((z, massSeed, chargeSeed) -> {
                    int mass = massSeed % 3 == 0 ? 0 : z + massSeed % (Species.MAX_MASS_NUMBER - z + 1);
                    Species species = new Species(z, mass, chargeSeed % z);
                    assertEquals(species, json.readValue(json.writeValueAsString(species), Species.class));
                    Map<Species, Integer> keyed = Map.of(species, z);
                    assertEquals(keyed, json.readValue(json.writeValueAsString(keyed),
                            new tools.jackson.core.type.TypeReference<Map<Species, Integer>>() { }));
                });
        qt().withFixedSeed(SEED).withExamples(500).forAll(integers().between(1, Integer.MAX_VALUE),
                integers().allPositive(), integers().between(0, 1)).checkAssert((n, lSeed, j) -> {
                    int l = (int) (lSeed % Math.min(n, 999_999_999L));
                    State state = State.of(n, l, l == 0 ? 1 : 2 * l - 1 + 2 * j);
                    assertEquals(state, json.readValue(json.writeValueAsString(state), State.class));
                    Map<State, Integer> keyed = Map.of(state, n);
                    assertEquals(keyed, json.readValue(json.writeValueAsString(keyed),
                            new tools.jackson.core.type.TypeReference<Map<State, Integer>>() { }));
                });
        qt().withFixedSeed(SEED).withExamples(300).forAll(media()).checkAssert(medium -> {
            assertEquals(medium, json.readValue(json.writeValueAsString(medium), Medium.class));
            if (medium instanceof Medium.Air) {
                AirModel model = ((Medium.Air) medium).model();
                assertEquals(medium, json.readValue(json.writeValueAsString(medium), Medium.Air.class));
                assertEquals(model, json.readValue(json.writeValueAsString(model), AirModel.class));
                assertEquals(model, json.readValue(json.writeValueAsString(model), model.getClass()));
            }
        });
        assertEquals(Medium.vacuum(), json.readValue("\"vacuum\"", Medium.Vacuum.class));
        for (Unit unit : Unit.values()) {
            assertEquals(unit, json.readValue(json.writeValueAsString(unit), Unit.class));
        }
    }

    @Test
    void aUsersRecordHoldingTheTypesRoundTrips() {
        qt().withFixedSeed(SEED).withExamples(100).forAll(positiveDoubles(), finiteDoubles(), media())
                .checkAssert((positive, any, medium) -> {
                    Map<Species, Wavenumber> shifts = new LinkedHashMap<>();
                    shifts.put(Species.parse("H I"), Wavenumber.of(any, Unit.PER_METRE));
                    shifts.put(Species.parse("D I"), Wavenumber.of(-any, 1.0, Unit.PER_METRE));
                    Observation observation = new Observation("Balmer alpha", Species.parse("He II"),
                            State.of(60, 40, 81), Wavelength.ofMetres(positive, medium),
                            Wavelength.ofMetres(positive, Medium.vacuum()), Temperature.ofKelvin(positive),
                            Temperature.of(positive, positive, Unit.KELVIN), Energy.ofJoules(any), medium,
                            StandardAir.INSTANCE, Unit.NANOMETRE, shifts, List.of(Frequency.ofHertz(positive)));
                    String text = json.writeValueAsString(observation);
                    assertEquals(observation, json.readValue(text, Observation.class), text);
                });
        // Nulls stay nulls (Jackson's convention for a null field), never a default value.
        Observation empty = new Observation(null, null, null, null, null, null, null, null, null, null, null, null,
                null);
        assertEquals(empty, json.readValue(json.writeValueAsString(empty), Observation.class));
    }

    @Test
    void theProjectsRecordsHoldingTheseTypesRoundTrip() {
        // Records serialise by their components; with the module their Species, State, Unit and Medium
        // components are text. The values are arbitrary test inputs, not physics.
        List<Object> records = List.of(new Target(Unit.NANOMETRE, Medium.air(Ciddor1996.STANDARD_AIR)),
                Target.of(Unit.PER_CENTIMETRE), new MeasuredLevel(State.of(5, 1, 3), 12_816.5, "test"),
                new Level(State.of(60, 0, 1), 33_000.5, 57.1, LevelOrigin.MEASURED),
                new PairState(State.of(60, 0, 1), 1, State.of(60, 1, 3), -1),
                new DecayChannel(State.of(60, 1, 3), State.of(5, 0, 1), 1e15, 1e3),
                new DataSetInfo("my-levels", DataKind.LEVELS, "test levels", "1",
                        new Provenance(Provenance.Kind.FROM_MEMORY, "test"), List.of(Species.parse("Rb-87 I"))),
                PhysicalConstants.PLANCK);
        for (Object record : records) {
            String text = json.writeValueAsString(record);
            assertEquals(record, json.readValue(text, record.getClass()), text);
        }
        assertEquals("{\"unit\":\"nm\",\"medium\":\"air(ciddor1996:T=15C,p=101325Pa,RH=0%,CO2=450ppm)\"}",
                json.writeValueAsString(records.get(0)));
    }

    /** A holder whose field is typed Object: Jackson's polymorphic typing writes a type id beside the value. */
    public record Holder(Object held) {
    }

    @Test
    void polymorphicTypingWritesATypeIdBesideTheShape() {
        PolymorphicTypeValidator ritzwerkOnly = BasicPolymorphicTypeValidator.builder()
                .allowIfSubType("org.ritzwerk.").build();
        JsonMapper typed = JsonMapper.builder().addModule(RitzwerkJackson.module())
                .activateDefaultTypingAsProperty(ritzwerkOnly, DefaultTyping.JAVA_LANG_OBJECT, "@type").build();
        Wavelength line = Wavelength.of(6.5628e-7, 1e-13, Unit.METRE, Medium.air());
        String text = typed.writeValueAsString(new Holder(line));
        assertEquals("{\"held\":{\"@type\":\"org.ritzwerk.quantity.Wavelength\",\"value\":6.5628E-7,"
                + "\"uncertainty\":1.0E-13,\"unit\":\"m\",\"medium\":\"air\"}}", text);
        assertEquals(new Holder(line), typed.readValue(text, Holder.class));
        // The type id after the fields: Jackson buffers the fields and hands them on.
        assertEquals(new Holder(line), typed.readValue("{\"held\":{\"value\":6.5628E-7,\"uncertainty\":1.0E-13,"
                + "\"unit\":\"m\",\"medium\":\"air\",\"@type\":\"org.ritzwerk.quantity.Wavelength\"}}",
                Holder.class));
        for (Object value : List.of(Species.parse("He II"), State.of(60, 40, 81), Medium.air(), Unit.ANGSTROM,
                Temperature.ofKelvin(300), Ciddor1996.STANDARD_AIR)) {
            String written = typed.writeValueAsString(new Holder(value));
            assertEquals(new Holder(value), typed.readValue(written, Holder.class), written);
        }
    }

    // ---- Refusals: the message names the type and field, and the path ends at the field.

    @Test
    void badQuantitiesAreRefusedNamingTheField() {
        assertRefused("{\"unit\":\"m\",\"medium\":\"air\"}", Wavelength.class, "value",
                "Wavelength field \"value\": missing; a quantity needs \"value\" (a JSON number) and \"unit\"");
        assertRefused("{\"value\":5e-7,\"medium\":\"air\"}", Wavelength.class, "unit",
                "Wavelength field \"unit\": missing; a quantity needs \"value\" and \"unit\" (a unit symbol such"
                        + " as \"m\")");
        assertRefused("{\"value\":5e-7,\"unit\":\"m\"}", Wavelength.class, "medium",
                "Wavelength field \"medium\": missing; a wavelength needs its medium: \"vacuum\", \"air\" or "
                        + "\"air(<model>)\"");
        assertRefused("{\"value\":5,\"unit\":\"furlong\",\"medium\":\"air\"}", Wavelength.class, "unit",
                "Wavelength field \"unit\": unknown unit 'furlong'; known units: m, um, nm, \u00c5, m-1, cm-1, Hz,"
                        + " kHz, MHz, GHz, THz, J, eV, meV, K");
        assertRefused("{\"value\":5,\"unit\":\"eV\",\"medium\":\"air\"}", Wavelength.class, "unit",
                "Wavelength field \"unit\": unit 'eV' measures an energy, not a wavelength");
        assertRefused("{\"value\":5,\"unit\":\"K\"}", SpectralQuantity.class, "unit",
                "SpectralQuantity field \"unit\": unit 'K' measures a temperature, not a wavelength, wavenumber,"
                        + " frequency or energy");
        assertRefused("{\"value\":5e-7,\"unit\":\"m\",\"medium\":\"water\"}", Wavelength.class, "medium",
                "Wavelength field \"medium\": unknown medium 'water'; expected vacuum, air or air(<model>), e.g. "
                        + "air(ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm)");
        assertRefused("{\"value\":5e-7,\"unit\":\"m\",\"medium\":\"air(ciddor1996:T=200C,p=101325Pa,RH=40%,"
                + "CO2=450ppm)\"}", Wavelength.class, "medium", "Wavelength field \"medium\": Ciddor 1996 air model:"
                        + " temperature 200.0 C is outside the model's range -40 to 100 C");
        assertRefused("{\"value\":13.6,\"unit\":\"eV\",\"medium\":\"air\"}", Energy.class, "medium",
                "Energy field \"medium\": only a wavelength has a medium, not an energy; leave the field out");
        assertRefused("{\"value\":\"656.28\",\"unit\":\"nm\",\"medium\":\"air\"}", Wavelength.class, "value",
                "Wavelength field \"value\": expected a JSON number, got a string 656.28");
        assertRefused("{\"value\":1e400,\"unit\":\"Hz\"}", Frequency.class, "value",
                "Frequency field \"value\": must be a finite number, got 1e400, which is too large for a double");
        assertRefused("{\"value\":-656.28,\"unit\":\"nm\",\"medium\":\"air\"}", Wavelength.class, "value",
                "Wavelength field \"value\": wavelength must be positive, got -656.28 nm");
        assertRefused("{\"value\":656.28,\"uncertainty\":-1,\"unit\":\"nm\",\"medium\":\"air\"}", Wavelength.class,
                "uncertainty", "Wavelength field \"uncertainty\": standard uncertainty of the wavelength must be a "
                        + "finite number >= 0 nm, got -1");
        assertRefused("{\"value\":300,\"uncertainty\":null,\"unit\":\"K\"}", Temperature.class, "uncertainty",
                "Temperature field \"uncertainty\": null is not a number; leave the field out when no uncertainty"
                        + " is stated");
        assertRefused("{\"value\":300,\"value\":301,\"unit\":\"K\"}", Temperature.class, "value",
                "Temperature field \"value\": given twice");
        assertRefused("{\"value\":300,\"unti\":\"K\"}", Temperature.class, null,
                "Temperature: unknown field \"unti\"; known fields: value, uncertainty, unit, medium");
        assertRefused("\"656.28 nm\"", Wavelength.class, null, "Wavelength: expected a JSON object such as "
                + "{\"value\":6.5628E-7,\"unit\":\"m\",\"medium\":\"air\"}, got a string");
        assertRefused("{\"value\":[1],\"unit\":\"K\"}", Temperature.class, "value",
                "Temperature field \"value\": expected a JSON number, got an array");
        assertRefused("{\"value\":1,\"unit\":3}", Temperature.class, "unit",
                "Temperature field \"unit\": expected a JSON string, got a number 3");
    }

    @Test
    void nonFiniteNumbersAreRefusedWhereTheParserAllowsThem() {
        // With JSON's non-numeric extension on, NaN and Infinity reach the deserialiser as numbers.
        JsonMapper lenient = JsonMapper.builder().enable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
                .addModule(RitzwerkJackson.module()).build();
        DatabindException nan = assertThrows(DatabindException.class,
                () -> lenient.readValue("{\"value\":NaN,\"unit\":\"eV\"}", Energy.class));
        assertEquals("Energy field \"value\": must be a finite number, got NaN", nan.getOriginalMessage());
        DatabindException infinite = assertThrows(DatabindException.class,
                () -> lenient.readValue("{\"value\":1,\"uncertainty\":Infinity,\"unit\":\"eV\"}", Energy.class));
        assertEquals("Energy field \"uncertainty\": must be a finite number, got Infinity, which is too large for a"
                + " double", infinite.getOriginalMessage());
        // Without the extension (the default) the parser itself refuses the token.
        assertThrows(JacksonException.class, () -> json.readValue("{\"value\":NaN,\"unit\":\"eV\"}", Energy.class));
    }

    @Test
    void badTextValuesAreRefusedWithTheParsersReason() {
        assertRefused("\"Xx II\"", Species.class, null,
                "Species: cannot read species \"Xx II\": unknown element 'Xx'");
        assertRefused("\"He III\"", Species.class, null, "Species: cannot read species \"He III\": charge 2 (spectrum"
                + " III) is impossible for He, which has 2 electrons: the highest is II");
        assertRefused("{\"z\":2,\"massNumber\":0,\"charge\":1}", Species.class, null,
                "Species: expected a JSON string, species notation such as 'He II' or 'Rb-87 I', got an object");
        assertRefused("\"43d7/2\"", State.class, null, "State: cannot read state \"43d7/2\": j must be l +- 1/2 (and"
                + " 1/2 for l = 0); got l = 2, 2j = 7");
        assertRefused("\"water\"", Medium.class, null, "Medium: unknown medium 'water'; expected vacuum, air or "
                + "air(<model>), e.g. air(ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm)");
        assertRefused("\"air\"", Medium.Vacuum.class, null, "Vacuum: the medium 'air' is not a Vacuum");
        assertRefused("\"standard\"", Ciddor1996.class, null,
                "Ciddor1996: the air model 'standard' is not a Ciddor1996");
        assertRefused("\"furlong\"", Unit.class, null, "Unit: unknown unit 'furlong'; known units: m, um, nm, "
                + "\u00c5, m-1, cm-1, Hz, kHz, MHz, GHz, THz, J, eV, meV, K");
        assertThrows(DatabindException.class, () -> json.readValue("{\"Xx I\":1}",
                new tools.jackson.core.type.TypeReference<Map<Species, Integer>>() { }));
        // Inside a user's record the path leads to the field.
        DatabindException nested = assertThrows(DatabindException.class, () -> json.readValue(
                "{\"line\":{\"value\":5e-7,\"unit\":\"m\",\"medium\":\"water\"}}", Observation.class));
        assertTrue(nested.getMessage().contains("Observation[\"line\"]->org.ritzwerk.quantity.Wavelength"
                + "[\"medium\"]"), nested.getMessage());
    }

    @Test
    void aThirdPartyAirModelThatCannotBeReadBackIsRefusedOnWriting() {
        AirModel own = new AirModel() {
            @Override
            public String spec() {
                return "my-lab-air";
            }

            @Override
            public String description() {
                return "a test model: n = 1.0003";
            }

            @Override
            public String citation() {
                return "none (test)";
            }

            @Override
            public double refractiveIndex(double vacuumWavelengthMetres) {
                return 1.0003;
            }

            @Override
            public double minVacuumWavelengthMetres() {
                return 2e-7;
            }

            @Override
            public double maxVacuumWavelengthMetres() {
                return 2e-6;
            }
        };
        DatabindException e = assertThrows(DatabindException.class,
                () -> json.writeValueAsString(Wavelength.ofMetres(5e-7, Medium.air(own))));
        assertTrue(e.getOriginalMessage().startsWith("Wavelength field \"medium\": the medium air(my-lab-air) cannot"
                + " be written: its text does not read back into the same medium"), e.getOriginalMessage());
        assertThrows(DatabindException.class, () -> json.writeValueAsString(own));
    }

    // ---- Helpers.

    private <Q extends Quantity> void assertRoundTrip(Q quantity, Class<Q> type) {
        String text = json.writeValueAsString(quantity);
        assertEquals(quantity, json.readValue(text, type), text);
        assertEquals(quantity, json.readValue(text, Quantity.class), text);
        if (quantity instanceof SpectralQuantity) {
            assertEquals(quantity, json.readValue(text, SpectralQuantity.class), text);
        }
    }

    private void assertRefused(String text, Class<?> type, String field, String message) {
        DatabindException e = assertThrows(DatabindException.class, () -> json.readValue(text, type), text);
        assertEquals(message, e.getOriginalMessage());
        if (field != null) {
            assertEquals(field, e.getPath().get(e.getPath().size() - 1).getPropertyName(), e.getMessage());
        }
    }

    /** Any positive finite double: random bits with the sign cleared (subnormals to MAX_VALUE). */
    private static Gen<Double> positiveDoubles() {
        return longs().all().map(bits -> Double.longBitsToDouble(bits & Long.MAX_VALUE))
                .map(d -> Double.isFinite(d) && d > 0 ? d : 1.0);
    }

    /** Any finite double, of either sign and both zeros, from random bits. */
    private static Gen<Double> finiteDoubles() {
        return longs().all().map(Double::longBitsToDouble).map(d -> Double.isFinite(d) ? d : -0.0);
    }

    /** -1 for "no uncertainty stated", else any finite double >= 0. */
    private static Gen<Double> uncertainties() {
        return longs().all().map(bits -> bits % 4 == 0 ? -1.0 : Double.longBitsToDouble(bits & Long.MAX_VALUE))
                .map(d -> Double.isFinite(d) ? d : 0.0);
    }

    /** Vacuum, standard air, and Ciddor air over the whole of the model's range of conditions. */
    private static Gen<Medium> media() {
        Gen<Ciddor1996> ciddor = doubles().between(-40, 100).zip(doubles().between(10_000, 140_000),
                doubles().between(0, 100), (t, p, rh) -> new Ciddor1996(t, p, rh, Math.abs(t * p) % 2000));
        return integers().between(0, 3).zip(ciddor, (k, model) -> k == 0 ? Medium.vacuum()
                : k == 1 ? Medium.air() : k == 2 ? Medium.air(Ciddor1996.STANDARD_AIR) : Medium.air(model));
    }
}
