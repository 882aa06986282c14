package org.ritzwerk.refdata;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.function.Function;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.SpeciesParseException;
import org.ritzwerk.atom.State;
import org.ritzwerk.atom.StateParseException;
import org.ritzwerk.medium.AirModel;
import org.ritzwerk.medium.AirModels;
import org.ritzwerk.medium.Ciddor1996;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import org.ritzwerk.medium.StandardAir;
import org.ritzwerk.quantity.Energy;
import org.ritzwerk.quantity.Frequency;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Quantity;
import org.ritzwerk.quantity.SpectralQuantity;
import org.ritzwerk.quantity.Temperature;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;
import org.ritzwerk.quantity.Wavenumber;
import tools.jackson.core.JsonGenerator;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.core.type.WritableTypeId;
import tools.jackson.databind.BeanDescription;
import tools.jackson.databind.BeanProperty;
import tools.jackson.databind.DatabindException;
import tools.jackson.databind.DeserializationContext;
import tools.jackson.databind.JacksonModule;
import tools.jackson.databind.KeyDeserializer;
import tools.jackson.databind.SerializationConfig;
import tools.jackson.databind.SerializationContext;
import tools.jackson.databind.ValueDeserializer;
import tools.jackson.databind.ValueSerializer;
import tools.jackson.databind.deser.jdk.NumberDeserializers;
import tools.jackson.databind.jsontype.TypeDeserializer;
import tools.jackson.databind.type.LogicalType;
import tools.jackson.databind.util.AccessPattern;
import tools.jackson.databind.deser.std.StdDeserializer;
import tools.jackson.databind.exc.InvalidFormatException;
import tools.jackson.databind.exc.MismatchedInputException;
import tools.jackson.databind.ser.BeanPropertyWriter;
import tools.jackson.databind.jsontype.TypeSerializer;
import tools.jackson.databind.module.SimpleModule;
import tools.jackson.databind.ser.ValueSerializerModifier;
import tools.jackson.databind.ser.std.StdSerializer;
import tools.jackson.databind.ser.std.ToEmptyObjectSerializer;

/**
 * A Jackson 3 module that writes and reads Ritzwerk's value types in a documented, stable JSON
 * shape. Register it on the mapper that holds these types:
 * {@code JsonMapper.builder().addModule(RitzwerkJackson.module()).build()}. Without it Jackson
 * writes a quantity as {@code {}} and cannot read it back.
 *
 * <p><b>Quantities</b> ({@link Wavelength}, {@link Wavenumber}, {@link Frequency}, {@link Energy},
 * {@link Temperature}) are objects. They are written with the value in the canonical SI unit the
 * quantity holds (m, m-1, Hz, J, K), so a round trip is exact to the bit; the standard
 * uncertainty only when one is stated; a wavelength's medium always:
 * <pre>
 * {"value":6.5628E-7,"unit":"m","medium":"air"}
 * {"value":6.5628E-7,"uncertainty":1.0E-13,"unit":"m","medium":"air(ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm)"}
 * {"value":1.5E15,"unit":"Hz"}
 * {"value":-2.1E-19,"unit":"J"}
 * {"value":5000.0,"unit":"K"}
 * </pre>
 * On reading, {@code "value"} (a JSON number) and {@code "unit"} (a symbol or alias that
 * {@link Unit#fromSymbol(String)} knows, of the kind asked for: {@code "nm"}, {@code "cm-1"},
 * {@code "eV"}, ...) are required, and the value is taken in that unit through the type's own
 * factory, with its checks ({@code {"value":656.28,"unit":"nm","medium":"air"}} reads too).
 * {@code "uncertainty"} (a JSON number, in the same unit) is optional; leaving it out means none
 * was stated. {@code "medium"} ({@code "vacuum"}, {@code "air"} or {@code "air(<model spec>)"},
 * the text of {@link Medium#spec()}) is required for a wavelength and refused for any other
 * quantity. A field typed {@link Quantity} or {@link SpectralQuantity} reads the type the unit
 * names.
 *
 * <p><b>Text values.</b> A {@link Species} is its notation ({@code "He II"}, {@code "Rb-87 I"},
 * {@code "D I"}; read with {@link Species#parse(String)}, which also takes {@code "He+"}); a
 * {@link State} its label ({@code "5s1/2"}, {@code "60(l=40)81/2"}; {@link State#parse(String)});
 * a {@link Medium} its spec ({@code "vacuum"}, {@code "air"}, {@code "air(ciddor1996:...)"}); an
 * {@link AirModel} its spec ({@code "standard"}, {@code "ciddor1996:T=20C,..."}); a {@link Unit}
 * its symbol ({@code "nm"}, {@code "\u00c5"}). Species and states are written the same way as map
 * keys.
 *
 * <p><b>Refusals.</b> Bad input throws Jackson's {@link DatabindException} (a
 * {@link MismatchedInputException}), whose message names the type and the field (for example
 * {@code Wavelength field "unit": unknown unit 'furlong'; known units: m, um, ...}) and whose
 * path ends at that field; never a NaN, a default or a silently rewritten value. Refused: a
 * missing value or unit, a value or uncertainty that is not a JSON number or not finite, an
 * unknown unit or one of another kind, a missing, unknown or misplaced medium, an unknown or
 * repeated field, a null uncertainty, unparseable species, states, media, models and units, and
 * whatever the type's factory refuses (a negative wavelength, a negative uncertainty). Writing
 * refuses an air model of a third party whose spec does not read back into an equal model (the
 * built-in {@link AirModels} parser knows only the built-in models).
 *
 * <p><b>Not estimated.</b> A Ritzwerk record's double component that holds NaN for "not estimated"
 * (the uncertainty of a {@code Level}, for example) is written as JSON {@code null}, never as Jackson's
 * default {@code "NaN"}; reading such a record takes {@code null} back as NaN, so the record's own
 * constructor decides whether that component may be unknown, and refuses a record whose double
 * component is missing altogether (Jackson alone would read it as 0, an uncertainty of zero).
 * Doubles of other classes, the caller's own included, keep Jackson's behaviour.
 *
 * <p>A Ritzwerk class without a JSON shape (results such as {@code LineSet}, {@code Calibration},
 * {@code PeakList}, whose accessors are not getters) is refused on writing with a
 * {@link DatabindException} naming it, where Jackson alone would write {@code {}}; write those with
 * their own file formats.
 *
 * <p>Jackson's polymorphic typing (default typing, or {@code @JsonTypeInfo} on a user's field
 * typed {@code Object}) writes its type id beside these shapes and reads them back.
 *
 * <p>Stateless; each call of {@link #module()} returns a new module. The serialisers and
 * deserialisers it registers are immutable and thread-safe.
 */
public final class RitzwerkJackson {

    /** The name the module registers under, {@value}. */
    public static final String MODULE_NAME = "ritzwerk";

    private static final String VALUE = "value";
    private static final String UNCERTAINTY = "uncertainty";
    private static final String UNIT = "unit";
    private static final String MEDIUM = "medium";
    private static final List<String> FIELDS = List.of(VALUE, UNCERTAINTY, UNIT, MEDIUM);

    private RitzwerkJackson() {
    }

    /**
     * @return a new module with the serialisers and deserialisers of Ritzwerk's value types (see
     *         the class comment for the JSON shapes)
     */
    public static JacksonModule module() {
        SimpleModule module = new SimpleModule(MODULE_NAME);
        QuantitySerializer quantities = new QuantitySerializer();
        for (Class<? extends Quantity> type : List.of(Wavelength.class, Wavenumber.class, Frequency.class,
                Energy.class, Temperature.class)) {
            module.addSerializer(type, quantities);
        }
        module.addDeserializer(Wavelength.class, new QuantityDeserializer<>(Wavelength.class, Kind.WAVELENGTH));
        module.addDeserializer(Wavenumber.class, new QuantityDeserializer<>(Wavenumber.class, Kind.WAVENUMBER));
        module.addDeserializer(Frequency.class, new QuantityDeserializer<>(Frequency.class, Kind.FREQUENCY));
        module.addDeserializer(Energy.class, new QuantityDeserializer<>(Energy.class, Kind.ENERGY));
        module.addDeserializer(Temperature.class, new QuantityDeserializer<>(Temperature.class, Kind.TEMPERATURE));
        module.addDeserializer(SpectralQuantity.class, new QuantityDeserializer<>(SpectralQuantity.class,
                Kind.WAVELENGTH, Kind.WAVENUMBER, Kind.FREQUENCY, Kind.ENERGY));
        module.addDeserializer(Quantity.class, new QuantityDeserializer<>(Quantity.class, Kind.values()));

        module.addSerializer(Species.class, new TextSerializer<>(Species.class, Species::notation));
        module.addDeserializer(Species.class, new TextDeserializer<>(Species.class, "species notation such as "
                + "'He II' or 'Rb-87 I'", RitzwerkJackson::species));
        module.addKeySerializer(Species.class, new KeySerializer<>(Species.class, Species::notation));
        module.addKeyDeserializer(Species.class, new TextKeyDeserializer(Species.class, RitzwerkJackson::species));
        module.addSerializer(State.class, new TextSerializer<>(State.class, State::label));
        module.addDeserializer(State.class, new TextDeserializer<>(State.class, "a state label such as '5s1/2'",
                RitzwerkJackson::state));
        module.addKeySerializer(State.class, new KeySerializer<>(State.class, State::label));
        module.addKeyDeserializer(State.class, new TextKeyDeserializer(State.class, RitzwerkJackson::state));

        TextSerializer<Medium> media = new TextSerializer<>(Medium.class, RitzwerkJackson::writableSpec);
        module.addSerializer(Medium.class, media);
        module.addSerializer(Medium.Vacuum.class, media);
        module.addSerializer(Medium.Air.class, media);
        module.addDeserializer(Medium.class, mediumDeserializer(Medium.class));
        module.addDeserializer(Medium.Vacuum.class, mediumDeserializer(Medium.Vacuum.class));
        module.addDeserializer(Medium.Air.class, mediumDeserializer(Medium.Air.class));

        TextSerializer<AirModel> models = new TextSerializer<>(AirModel.class, RitzwerkJackson::writableSpec);
        module.addSerializer(AirModel.class, models);
        module.addSerializer(StandardAir.class, models);
        module.addSerializer(Ciddor1996.class, models);
        module.addDeserializer(AirModel.class, modelDeserializer(AirModel.class));
        module.addDeserializer(StandardAir.class, modelDeserializer(StandardAir.class));
        module.addDeserializer(Ciddor1996.class, modelDeserializer(Ciddor1996.class));

        module.addSerializer(Unit.class, new TextSerializer<>(Unit.class, Unit::symbol));
        module.addDeserializer(Unit.class, new TextDeserializer<>(Unit.class, "a unit symbol such as 'nm'",
                symbol -> Unit.fromSymbol(symbol).orElseThrow(() -> new IllegalArgumentException(
                        unknownUnit(symbol)))));

        module.setSerializerModifier(new NoEmptyObjects());
        module.addDeserializer(Double.TYPE, new NotEstimatedDouble(Double.TYPE, null));
        module.addDeserializer(Double.class, new NotEstimatedDouble(Double.class, null));
        return module;
    }

    private static Species species(String text) {
        try {
            return Species.parse(text);
        } catch (SpeciesParseException e) {
            throw new IllegalArgumentException(e.getMessage(), e);
        }
    }

    private static State state(String text) {
        try {
            return State.parse(text);
        } catch (StateParseException e) {
            throw new IllegalArgumentException(e.getMessage(), e);
        }
    }

    private static <M extends Medium> TextDeserializer<M> mediumDeserializer(Class<M> type) {
        return new TextDeserializer<>(type, "a medium: 'vacuum', 'air' or 'air(<model>)'",
                text -> ofType(type, medium(text), "medium", text));
    }

    private static <A extends AirModel> TextDeserializer<A> modelDeserializer(Class<A> type) {
        return new TextDeserializer<>(type, "an air model spec such as 'standard' or 'ciddor1996'", text -> {
            try {
                return ofType(type, AirModels.parse(text), "air model", text);
            } catch (MediumException e) {
                throw new IllegalArgumentException(e.getMessage(), e);
            }
        });
    }

    private static Medium medium(String text) {
        try {
            return Medium.parse(text);
        } catch (MediumException e) {
            throw new IllegalArgumentException(e.getMessage(), e);
        }
    }

    private static <T> T ofType(Class<T> type, Object value, String what, String text) {
        if (!type.isInstance(value)) {
            throw new IllegalArgumentException("the " + what + " '" + text.strip() + "' is not a "
                    + type.getSimpleName());
        }
        return type.cast(value);
    }

    /** The spec of a medium, refused when it would not read back into an equal medium. */
    private static String writableSpec(Medium medium) {
        String spec = medium.spec();
        if (!readsBack(spec, Medium::parse, medium)) {
            throw new IllegalArgumentException("the medium " + spec + " cannot be written: its text does not read "
                    + "back into the same medium (an air model of a third party, " + modelClass(medium) + ")");
        }
        return spec;
    }

    /** The spec of an air model, refused when it would not read back into an equal model. */
    private static String writableSpec(AirModel model) {
        String spec = model.spec();
        if (!readsBack(spec, AirModels::parse, model)) {
            throw new IllegalArgumentException("the air model '" + spec + "' (" + model.getClass().getName()
                    + ") cannot be written: its spec does not read back into the same model");
        }
        return spec;
    }

    private static <T> boolean readsBack(String spec, Function<String, T> parser, T value) {
        try {
            return parser.apply(spec).equals(value);
        } catch (MediumException e) {
            return false;
        }
    }

    private static String modelClass(Medium medium) {
        return medium instanceof Medium.Air ? ((Medium.Air) medium).model().getClass().getName() : "none";
    }

    /** "a wavelength", "an energy". */
    private static String withArticle(String noun) {
        return ("aeiou".indexOf(noun.charAt(0)) >= 0 ? "an " : "a ") + noun;
    }

    private static String unknownUnit(String symbol) {
        return "unknown unit '" + symbol + "'; known units: " + String.join(", ", Unit.knownSymbols());
    }

    /** The canonical SI unit of a kind, in which quantities are written. */
    static Unit siUnit(Kind kind) {
        switch (kind) {
            case WAVELENGTH:
                return Unit.METRE;
            case WAVENUMBER:
                return Unit.PER_METRE;
            case FREQUENCY:
                return Unit.HERTZ;
            case ENERGY:
                return Unit.JOULE;
            default:
                return Unit.KELVIN;
        }
    }

    /** Words for a token, for messages: "a string", "an object", ... */
    private static String describe(JsonToken token) {
        if (token == null) {
            return "the end of the input";
        }
        switch (token) {
            case VALUE_STRING:
                return "a string";
            case VALUE_NUMBER_INT:
            case VALUE_NUMBER_FLOAT:
                return "a number";
            case VALUE_TRUE:
            case VALUE_FALSE:
                return "a boolean";
            case VALUE_NULL:
                return "null";
            case START_OBJECT:
                return "an object";
            case START_ARRAY:
                return "an array";
            default:
                return token.toString();
        }
    }

    /**
     * The exception for bad input: the message names the type and (when not null) the field, and
     * the path ends at the field.
     */
    private static DatabindException refused(JsonParser p, Class<?> type, String field, String problem) {
        String where = field == null ? type.getSimpleName() + ": " : type.getSimpleName() + " field \"" + field
                + "\": ";
        MismatchedInputException e = MismatchedInputException.from(p, type, where + problem);
        if (field != null) {
            e.prependPath(type, field);
        }
        return e;
    }

    /**
     * Replaces the empty-object serialiser Jackson makes for a Ritzwerk class it finds no properties
     * in (a result such as a line set or a calibration, whose accessors are not getters) by one that
     * refuses, so such a value is never written as a silent {@code {}}.
     */
    private static final class NoEmptyObjects extends ValueSerializerModifier {
        private static final long serialVersionUID = 1L;

        @Override
        public ValueSerializer<?> modifySerializer(SerializationConfig config, BeanDescription.Supplier beanDesc,
                ValueSerializer<?> serializer) {
            Class<?> type = beanDesc.getBeanClass();
            if (serializer instanceof ToEmptyObjectSerializer && type.getName().startsWith("org.ritzwerk.")) {
                return new NoShapeSerializer(type);
            }
            return serializer;
        }

        @Override
        public List<BeanPropertyWriter> changeProperties(SerializationConfig config,
                BeanDescription.Supplier beanDesc, List<BeanPropertyWriter> properties) {
            if (!ritzwerk(beanDesc.getBeanClass())) {
                return properties;
            }
            List<BeanPropertyWriter> out = new ArrayList<>(properties.size());
            for (BeanPropertyWriter w : properties) {
                Class<?> raw = w.getType().getRawClass();
                boolean floating = raw == double.class || raw == Double.class || raw == float.class
                        || raw == Float.class;
                out.add(floating ? new NotEstimatedAsNull(w) : w);
            }
            return out;
        }
    }

    /** Whether a class is one of Ritzwerk's own (whose NaN doubles mean "not estimated"). */
    private static boolean ritzwerk(Class<?> type) {
        return type != null && type.getName().startsWith("org.ritzwerk.");
    }

    /** Writes a NaN double of a Ritzwerk class as null ("not estimated"), never as "NaN". */
    private static final class NotEstimatedAsNull extends BeanPropertyWriter {
        private static final long serialVersionUID = 1L;

        NotEstimatedAsNull(BeanPropertyWriter base) {
            super(base);
        }

        @Override
        public void serializeAsProperty(Object bean, JsonGenerator g, SerializationContext ctxt) throws Exception {
            Object value = get(bean);
            if (value instanceof Double d && d.isNaN() || value instanceof Float f && f.isNaN()) {
                if (!_suppressNulls) {
                    g.writeName(_name);
                    g.writeNull();
                }
                return;
            }
            super.serializeAsProperty(bean, g, ctxt);
        }
    }

    /**
     * Reads a double the standard way, except a component of a Ritzwerk class: there null is NaN ("not
     * estimated"; the class's constructor decides whether that is allowed) and a missing one is refused.
     */
    private static final class NotEstimatedDouble extends StdDeserializer<Double> {
        private static final long serialVersionUID = 1L;

        /** Jackson's own deserializer of the type, which reads every value. */
        private final ValueDeserializer<?> standard;
        /** The Ritzwerk property this instance reads, or null for the standard behaviour. */
        private final BeanProperty property;

        NotEstimatedDouble(Class<?> type, BeanProperty property) {
            super(type);
            this.standard = NumberDeserializers.find(type);
            this.property = property;
        }

        @Override
        public ValueDeserializer<?> createContextual(DeserializationContext ctxt, BeanProperty property) {
            if (property != null && property.getMember() != null
                    && ritzwerk(property.getMember().getDeclaringClass())) {
                return new NotEstimatedDouble(handledType(), property);
            }
            return standard;
        }

        @Override
        public Double deserialize(JsonParser p, DeserializationContext ctxt) {
            return (Double) standard.deserialize(p, ctxt);
        }

        @Override
        public Object deserializeWithType(JsonParser p, DeserializationContext ctxt, TypeDeserializer types) {
            return standard.deserializeWithType(p, ctxt, types);
        }

        @Override
        public AccessPattern getNullAccessPattern() {
            return AccessPattern.DYNAMIC;
        }

        @Override
        public Object getNullValue(DeserializationContext ctxt) {
            return property == null ? standard.getNullValue(ctxt) : Double.NaN;
        }

        @Override
        public Object getAbsentValue(DeserializationContext ctxt) {
            if (property == null) {
                return standard.getAbsentValue(ctxt);
            }
            return ctxt.reportInputMismatch(this, "%s field \"%s\" is missing (write null for a value that is not "
                    + "estimated)", property.getMember().getDeclaringClass().getSimpleName(), property.getName());
        }

        @Override
        public LogicalType logicalType() {
            return LogicalType.Float;
        }
    }

    /** Refuses to write a Ritzwerk value that has no JSON shape. */
    private static final class NoShapeSerializer extends StdSerializer<Object> {

        NoShapeSerializer(Class<?> type) {
            super(type);
        }

        @Override
        public void serialize(Object value, JsonGenerator gen, SerializationContext ctxt) {
            throw refusal(value, gen);
        }

        @Override
        public void serializeWithType(Object value, JsonGenerator gen, SerializationContext ctxt,
                TypeSerializer typeSer) {
            throw refusal(value, gen);
        }

        private static DatabindException refusal(Object value, JsonGenerator gen) {
            return DatabindException.from(gen, value.getClass().getName() + " has no JSON shape (Jackson would "
                    + "write {}): write it with its own file format (the *Files classes of org.ritzwerk.refdata), or "
                    + "put the values you need (quantities, species, states) in a record of your own");
        }
    }

    /** Writes a quantity as {"value", "uncertainty" (when stated), "unit", "medium" (wavelengths)}. */
    private static final class QuantitySerializer extends StdSerializer<Quantity> {

        QuantitySerializer() {
            super(Quantity.class);
        }

        @Override
        public void serialize(Quantity quantity, JsonGenerator gen, SerializationContext ctxt) {
            String medium = medium(quantity, gen);
            gen.writeStartObject(quantity);
            writeFields(quantity, medium, gen);
            gen.writeEndObject();
        }

        /** With a type id, for polymorphic typing (annotations on a user's field or default typing). */
        @Override
        public void serializeWithType(Quantity quantity, JsonGenerator gen, SerializationContext ctxt,
                TypeSerializer typeSer) {
            String medium = medium(quantity, gen);
            WritableTypeId typeId = typeSer.writeTypePrefix(gen, ctxt, typeSer.typeId(quantity,
                    JsonToken.START_OBJECT));
            writeFields(quantity, medium, gen);
            typeSer.writeTypeSuffix(gen, ctxt, typeId);
        }

        /** The medium's text for a wavelength (checked before anything is written), else null. */
        private static String medium(Quantity quantity, JsonGenerator gen) {
            if (!(quantity instanceof Wavelength)) {
                return null;
            }
            try {
                return writableSpec(((Wavelength) quantity).medium());
            } catch (IllegalArgumentException e) {
                throw DatabindException.from(gen, "Wavelength field \"medium\": " + e.getMessage(), e);
            }
        }

        private static void writeFields(Quantity quantity, String medium, JsonGenerator gen) {
            Unit unit = siUnit(quantity.kind());
            gen.writeNumberProperty(VALUE, quantity.valueIn(unit));
            if (quantity.hasUncertainty()) {
                gen.writeNumberProperty(UNCERTAINTY, quantity.uncertaintyIn(unit).getAsDouble());
            }
            gen.writeStringProperty(UNIT, unit.symbol());
            if (medium != null) {
                gen.writeStringProperty(MEDIUM, medium);
            }
        }
    }

    /** Reads a quantity of one of the given kinds from the object {@link QuantitySerializer} writes. */
    private static final class QuantityDeserializer<Q extends Quantity> extends StdDeserializer<Q> {

        private final Class<Q> type;
        private final Set<Kind> kinds;

        QuantityDeserializer(Class<Q> type, Kind... kinds) {
            super(type);
            this.type = type;
            this.kinds = new LinkedHashSet<>(List.of(kinds));
        }

        @Override
        public Q deserialize(JsonParser p, DeserializationContext ctxt) {
            JsonToken token = p.currentToken();
            if (token == JsonToken.START_OBJECT) {
                token = p.nextToken();
            } else if (token != JsonToken.PROPERTY_NAME && token != JsonToken.END_OBJECT) {
                throw refused(p, type, null, "expected a JSON object such as {\"value\":6.5628E-7,\"unit\":\"m\","
                        + "\"medium\":\"air\"}, got " + describe(token));
            }
            Double value = null;
            Double uncertainty = null;
            String symbol = null;
            String mediumText = null;
            Set<String> seen = new LinkedHashSet<>();
            for (; token == JsonToken.PROPERTY_NAME; token = p.nextToken()) {
                String field = p.currentName();
                if (!FIELDS.contains(field)) {
                    throw refused(p, type, null, "unknown field \"" + field + "\"; known fields: "
                            + String.join(", ", FIELDS));
                }
                if (!seen.add(field)) {
                    throw refused(p, type, field, "given twice");
                }
                JsonToken valueToken = p.nextToken();
                switch (field) {
                    case VALUE:
                        value = number(p, field, valueToken);
                        break;
                    case UNCERTAINTY:
                        uncertainty = number(p, field, valueToken);
                        break;
                    case UNIT:
                        symbol = text(p, field, valueToken);
                        break;
                    default:
                        mediumText = text(p, field, valueToken);
                        break;
                }
            }
            if (token != JsonToken.END_OBJECT) {
                throw refused(p, type, null, "expected a field name or the end of the object, got "
                        + describe(token));
            }
            if (value == null) {
                throw refused(p, type, VALUE, "missing; a quantity needs \"value\" (a JSON number) and \"unit\"");
            }
            if (symbol == null) {
                throw refused(p, type, UNIT, "missing; a quantity needs \"value\" and \"unit\" (a unit symbol "
                        + "such as \"m\")");
            }
            String unitSymbol = symbol;
            Unit unit = Unit.fromSymbol(unitSymbol).orElseThrow(() -> refused(p, type, UNIT, unknownUnit(unitSymbol)));
            if (!kinds.contains(unit.kind())) {
                throw refused(p, type, UNIT, "unit '" + symbol + "' measures " + withArticle(unit.kind().noun())
                        + ", not " + withArticle(kindNouns()));
            }
            Medium medium = null;
            if (unit.kind() == Kind.WAVELENGTH) {
                if (mediumText == null) {
                    throw refused(p, type, MEDIUM, "missing; a wavelength needs its medium: \"vacuum\", \"air\" or "
                            + "\"air(<model>)\"");
                }
                try {
                    medium = Medium.parse(mediumText);
                } catch (MediumException e) {
                    throw refused(p, type, MEDIUM, e.getMessage());
                }
            } else if (mediumText != null) {
                throw refused(p, type, MEDIUM, "only a wavelength has a medium, not "
                        + withArticle(unit.kind().noun()) + "; leave the field out");
            }
            Quantity quantity;
            try {
                quantity = create(value, Double.NaN, unit, medium);
            } catch (IllegalArgumentException e) {
                throw refused(p, type, VALUE, e.getMessage());
            }
            if (uncertainty != null) {
                try {
                    quantity = create(value, uncertainty, unit, medium);
                } catch (IllegalArgumentException e) {
                    throw refused(p, type, UNCERTAINTY, e.getMessage());
                }
            }
            return type.cast(quantity);
        }

        private String kindNouns() {
            StringBuilder text = new StringBuilder();
            int i = 0;
            for (Kind kind : kinds) {
                text.append(i == 0 ? "" : i == kinds.size() - 1 ? " or " : ", ").append(kind.noun());
                i++;
            }
            return text.toString();
        }

        /** A finite double from a JSON number. */
        private double number(JsonParser p, String field, JsonToken token) {
            if (token == JsonToken.VALUE_NULL && field.equals(UNCERTAINTY)) {
                throw refused(p, type, field, "null is not a number; leave the field out when no uncertainty "
                        + "is stated");
            }
            if (token != JsonToken.VALUE_NUMBER_INT && token != JsonToken.VALUE_NUMBER_FLOAT) {
                if (token == JsonToken.START_OBJECT || token == JsonToken.START_ARRAY) {
                    throw refused(p, type, field, "expected a JSON number, got " + describe(token));
                }
                throw refused(p, type, field, "expected a JSON number, got " + describe(token) + " "
                        + p.getString());
            }
            double number = p.getDoubleValue();
            if (!Double.isFinite(number)) {
                throw refused(p, type, field, "must be a finite number, got " + p.getString()
                        + (Double.isNaN(number) ? "" : ", which is too large for a double"));
            }
            return number;
        }

        private String text(JsonParser p, String field, JsonToken token) {
            if (token != JsonToken.VALUE_STRING) {
                if (token == JsonToken.START_OBJECT || token == JsonToken.START_ARRAY) {
                    throw refused(p, type, field, "expected a JSON string, got " + describe(token));
                }
                throw refused(p, type, field, "expected a JSON string, got " + describe(token) + " " + p.getString());
            }
            return p.getString();
        }

        private static Quantity create(double value, double uncertainty, Unit unit, Medium medium) {
            return Quantity.of(value, uncertainty, unit, medium);
        }
    }

    /** Writes a value as one JSON string. */
    private static final class TextSerializer<T> extends StdSerializer<T> {

        private final Class<T> type;
        private final Function<T, String> text;

        TextSerializer(Class<T> type, Function<T, String> text) {
            super(type);
            this.type = type;
            this.text = text;
        }

        @Override
        public void serialize(T value, JsonGenerator gen, SerializationContext ctxt) {
            gen.writeString(text(value, gen));
        }

        /** With a type id, for polymorphic typing (annotations on a user's field or default typing). */
        @Override
        public void serializeWithType(T value, JsonGenerator gen, SerializationContext ctxt, TypeSerializer typeSer) {
            String written = text(value, gen);
            WritableTypeId typeId = typeSer.writeTypePrefix(gen, ctxt, typeSer.typeId(value, JsonToken.VALUE_STRING));
            gen.writeString(written);
            typeSer.writeTypeSuffix(gen, ctxt, typeId);
        }

        private String text(T value, JsonGenerator gen) {
            try {
                return text.apply(value);
            } catch (IllegalArgumentException e) {
                throw DatabindException.from(gen, type.getSimpleName() + ": " + e.getMessage(), e);
            }
        }
    }

    /** Writes a value as a map key. */
    private static final class KeySerializer<T> extends StdSerializer<T> {

        private final Function<T, String> text;

        KeySerializer(Class<T> type, Function<T, String> text) {
            super(type);
            this.text = text;
        }

        @Override
        public void serialize(T value, JsonGenerator gen, SerializationContext ctxt) {
            gen.writeName(text.apply(value));
        }
    }

    /** Reads a value from one JSON string with the project's parser. */
    private static final class TextDeserializer<T> extends StdDeserializer<T> {

        private final Class<T> type;
        private final String expected;
        private final Function<String, T> parser;

        TextDeserializer(Class<T> type, String expected, Function<String, T> parser) {
            super(type);
            this.type = type;
            this.expected = expected;
            this.parser = parser;
        }

        @Override
        public T deserialize(JsonParser p, DeserializationContext ctxt) {
            JsonToken token = p.currentToken();
            if (token != JsonToken.VALUE_STRING) {
                throw refused(p, type, null, "expected a JSON string, " + expected + ", got " + describe(token));
            }
            String text = p.getString();
            try {
                return parser.apply(text);
            } catch (IllegalArgumentException e) {
                throw InvalidFormatException.from(p, type.getSimpleName() + ": " + e.getMessage(), text, type);
            }
        }
    }

    /** Reads a map key with the project's parser. */
    private static final class TextKeyDeserializer extends KeyDeserializer {

        private final Class<?> type;
        private final Function<String, ?> parser;

        TextKeyDeserializer(Class<?> type, Function<String, ?> parser) {
            this.type = type;
            this.parser = parser;
        }

        @Override
        public Object deserializeKey(String key, DeserializationContext ctxt) {
            try {
                return parser.apply(key);
            } catch (IllegalArgumentException e) {
                return ctxt.handleWeirdKey(type, key, "%s", e.getMessage());
            }
        }
    }
}
