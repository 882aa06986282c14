package org.ritzwerk.refdata;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.ServiceConfigurationError;
import java.util.ServiceLoader;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentMap;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Origin;
import org.ritzwerk.data.ReferenceDataProvider;
import org.ritzwerk.refdata.internal.HydrogenLikeProvider;
import org.ritzwerk.refdata.internal.LampProvider;
import org.ritzwerk.refdata.internal.LevelProvider;
import org.ritzwerk.refdata.internal.NuclearProvider;
import org.ritzwerk.refdata.internal.RydbergProvider;
import org.ritzwerk.refdata.internal.SetDetails;

/**
 * The data sets available from a fixed list of providers, in order of precedence: the user's
 * files first, then third-party providers, then Ritzwerk's built-in data; among providers of the
 * same origin, higher {@link ReferenceDataProvider#priority()} first, then provider id. When two
 * providers offer the same data set id, the one earlier in that order answers.
 *
 * <p>A registry is an immutable value: {@link #withUserFile(Path)} returns a new one. Nothing is
 * global; {@link #discoverDefault()} is the opt-in way to find every provider on the module or
 * class path. Data sets are loaded on first use and cached; all methods are safe to call from
 * many threads. Listing ({@link #list()}) asks each provider what it offers without loading
 * anything: the built-in providers read their files' headers only, and a built-in set's rows are
 * read when it is first loaded, once per JVM, shared by every registry.
 *
 * <p>Code that needs typed data (nuclei, alkali atoms, lamp sets, line lists) takes a
 * {@link DataContext} built from a registry ({@link DataContext#of(DataRegistry)}), not a registry
 * reached through {@link #builtIn()} or {@link #discoverDefault()}.
 */
public final class DataRegistry {

    /** A data set as listed: what it is, who offers it, with what precedence. */
    public record Listing(DataSetInfo info, String providerId, Origin origin, int priority) {
    }

    private record Ranked(ReferenceDataProvider provider, Origin origin) {
    }

    private static final String BUILT_IN_PACKAGE = "org.ritzwerk.refdata.";

    private final List<Ranked> providers;
    private final ConcurrentMap<String, DataSet> cache = new ConcurrentHashMap<>();
    private volatile List<Listing> listings;

    private DataRegistry(List<Ranked> providers) {
        List<Ranked> sorted = new ArrayList<>(providers);
        sorted.sort(Comparator.<Ranked, Origin>comparing(Ranked::origin)
                .thenComparing(r -> -r.provider().priority())
                .thenComparing(r -> r.provider().id()));
        this.providers = List.copyOf(sorted);
    }

    /**
     * @return a new registry of Ritzwerk's built-in data only (nuclear data, lamp sets, computed
     *         sets, Rydberg quantum defects and levels): the built-in default, kept for
     *         compatibility; pass a {@link DataContext} to whatever needs data
     */
    public static DataRegistry builtIn() {
        return new DataRegistry(List.of(new Ranked(new NuclearProvider(), Origin.BUILT_IN),
                new Ranked(new LampProvider(), Origin.BUILT_IN), new Ranked(new HydrogenLikeProvider(), Origin.BUILT_IN),
                new Ranked(new RydbergProvider(), Origin.BUILT_IN), new Ranked(new LevelProvider(), Origin.BUILT_IN)));
    }

    /**
     * @return a registry of every provider {@link ServiceLoader} finds for this module (built-in
     *         ones included), the opt-in default; a new registry on every call, never kept in a
     *         static field
     */
    public static DataRegistry discoverDefault() {
        return discover(ServiceLoader.load(ReferenceDataProvider.class));
    }

    /**
     * @param loader the class loader whose class path (and named modules) to search
     * @return a registry of every provider found there
     */
    public static DataRegistry discover(ClassLoader loader) {
        return discover(ServiceLoader.load(ReferenceDataProvider.class, loader));
    }

    private static DataRegistry discover(ServiceLoader<ReferenceDataProvider> loader) {
        List<Ranked> found = new ArrayList<>();
        List<String> seen = new ArrayList<>();
        try {
            for (ReferenceDataProvider provider : loader) {
                String className = provider.getClass().getName();
                if (seen.contains(className)) {
                    continue;
                }
                seen.add(className);
                found.add(new Ranked(provider, className.startsWith(BUILT_IN_PACKAGE) ? Origin.BUILT_IN
                        : Origin.THIRD_PARTY));
            }
        } catch (ServiceConfigurationError e) {
            throw new ReferenceDataException(ReferenceDataException.PROVIDER_FAILED,
                    "a reference-data provider could not be loaded: " + e.getMessage());
        }
        return new DataRegistry(found);
    }

    /**
     * @param providers providers and the origin each one ranks with, for tests and embedding
     * @param origin    the origin of all of them
     * @return a registry of exactly these providers
     */
    public static DataRegistry of(List<? extends ReferenceDataProvider> providers, Origin origin) {
        java.util.Objects.requireNonNull(origin, "origin");
        List<Ranked> ranked = new ArrayList<>();
        java.util.Objects.requireNonNull(providers, "providers")
                .forEach(p -> ranked.add(new Ranked(java.util.Objects.requireNonNull(p, "provider"), origin)));
        return new DataRegistry(ranked);
    }

    /**
     * @param file a line list, level table, quantum-defect set or isotope table in the project's
     *             formats ({@link UserFiles}); read and checked now (a quantum-defect set's R_M
     *             with the built-in nuclear data; {@link DataContext#withUserFile(Path)} uses the
     *             context's)
     * @return a registry with that file first in precedence
     * @throws DataFileException with every problem in the file
     */
    public DataRegistry withUserFile(Path file) {
        return withUserFile(file, NuclearData::builtIn);
    }

    /** {@link #withUserFile(Path)} with the nuclear data a quantum-defect file's R_M comes from. */
    DataRegistry withUserFile(Path file, java.util.function.Supplier<NuclearData> nuclear) {
        UserFiles.UserFile read = UserFiles.read(file, nuclear);
        List<Ranked> more = new ArrayList<>(providers);
        more.add(new Ranked(new FileProvider(file.toString(), read), Origin.USER));
        return new DataRegistry(more);
    }

    /**
     * @param listing a listing of this registry
     * @return the nuclear data (with default isotopes) behind it, when its provider is one of
     *         Ritzwerk's own; else empty (then its {@link org.ritzwerk.data.IsotopeTable} is all there is)
     */
    Optional<NuclearData> nuclearData(Listing listing) {
        return details(listing).flatMap(d -> d.nuclearData(listing.info().id()));
    }

    private Optional<SetDetails> details(Listing listing) {
        return providers.stream().filter(r -> r.provider().id().equals(listing.providerId())
                && r.origin() == listing.origin() && r.provider() instanceof SetDetails)
                .map(r -> (SetDetails) r.provider()).findFirst();
    }

    /** @return every listed set in precedence order (a shadowed set is listed after the one that wins) */
    public List<Listing> list() {
        List<Listing> listed = listings;
        if (listed == null) {
            List<Listing> all = new ArrayList<>();
            for (Ranked ranked : providers) {
                List<DataSetInfo> infos;
                try {
                    infos = ranked.provider().dataSets();
                } catch (RuntimeException e) {
                    throw failed(ranked, "list its data sets", e);
                }
                for (DataSetInfo info : infos) {
                    all.add(new Listing(info, ranked.provider().id(), ranked.origin(), ranked.provider().priority()));
                }
            }
            listed = List.copyOf(all);
            listings = listed;
        }
        return listed;
    }

    /**
     * @param id a data set id
     * @return the listing that answers for that id (the first in precedence), if any
     */
    public Optional<Listing> find(String id) {
        return list().stream().filter(l -> l.info().id().equals(id)).findFirst();
    }

    /**
     * @param kind    a kind of data
     * @param species a species (its mass number is ignored when the set's is 0)
     * @return the listings of that kind covering the species, in precedence order, shadowed ids left out
     */
    public List<Listing> find(DataKind kind, Species species) {
        List<Listing> matches = new ArrayList<>();
        List<String> ids = new ArrayList<>();
        for (Listing listing : list()) {
            if (listing.info().kind() != kind || ids.contains(listing.info().id())) {
                continue;
            }
            ids.add(listing.info().id());
            for (Species covered : listing.info().species()) {
                if (covered.z() == species.z() && covered.charge() == species.charge()
                        && (covered.massNumber() == species.massNumber() || species.massNumber() == 0
                                || covered.massNumber() == 0)) {
                    matches.add(listing);
                    break;
                }
            }
        }
        return matches;
    }

    /**
     * @param species a lamp's species, e.g. {@code Ne I}
     * @return the lamp line set of highest precedence for it (a user file before a third-party
     *         provider before the built-in set)
     * @throws ReferenceDataException ({@code unknown-data-set}) when no lamp set covers the species
     */
    public LineList lampLines(Species species) {
        List<Listing> found = find(DataKind.LAMP_LINES, species);
        if (found.isEmpty()) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET, "no lamp set for "
                    + species.notation() + "; 'ritzwerk data' lists the sets available");
        }
        String id = found.get(0).info().id();
        DataSet set = load(id);
        if (!(set instanceof LineList)) {
            throw new ReferenceDataException(ReferenceDataException.PROVIDER_FAILED, "lamp set '" + id
                    + "' is not a line list");
        }
        return (LineList) set;
    }

    /**
     * @param id a data set id
     * @return the set, loaded once from the provider that answers for the id
     * @throws ReferenceDataException when no provider offers it or loading fails
     */
    public DataSet load(String id) {
        Objects.requireNonNull(id, "id");
        return cache.computeIfAbsent(id, key -> {
            Listing listing = find(key).orElseThrow(() -> new ReferenceDataException(
                    ReferenceDataException.UNKNOWN_DATA_SET, "no data set '" + key + "'; "
                            + "'ritzwerk data' lists the sets available"));
            Ranked ranked = providers.stream().filter(r -> r.provider().id().equals(listing.providerId())
                    && r.origin() == listing.origin()).findFirst().orElseThrow();
            DataSet set;
            try {
                set = ranked.provider().load(key);
            } catch (RitzwerkException e) {
                throw e;
            } catch (RuntimeException e) {
                throw failed(ranked, "load '" + key + "'", e);
            }
            if (set == null || !set.info().id().equals(key) || set.info().kind() != listing.info().kind()) {
                throw new ReferenceDataException(ReferenceDataException.PROVIDER_FAILED, "provider '"
                        + ranked.provider().id() + "' returned " + (set == null ? "nothing" : "set '"
                        + set.info().id() + "' of kind " + set.info().kind().id()) + " for '" + key + "'");
            }
            return set;
        });
    }

    private static ReferenceDataException failed(Ranked ranked, String what, RuntimeException e) {
        return new ReferenceDataException(ReferenceDataException.PROVIDER_FAILED, "provider '" + ranked.provider().id()
                + "' (" + ranked.origin().name().toLowerCase(java.util.Locale.ROOT).replace('_', '-')
                + ") failed to " + what + ": " + e);
    }

    /** A user file as a provider. */
    private record FileProvider(String name, UserFiles.UserFile file) implements ReferenceDataProvider, SetDetails {
        @Override
        public String id() {
            return "file:" + name;
        }

        @Override
        public Origin origin() {
            return Origin.USER;
        }

        @Override
        public List<DataSetInfo> dataSets() {
            return List.of(file.set().info());
        }

        @Override
        public DataSet load(String dataSetId) {
            return file.set();
        }

        @Override
        public Optional<NuclearData> nuclearData(String dataSetId) {
            return file.nuclear();
        }
    }

    /**
     * @return its providers in precedence order, each as its origin and id, e.g.
     *         {@code DataRegistry[user file:/data/my-lines.csv, built-in ritzwerk-lamps, ...]} (no data
     *         is read)
     */
    @Override
    public String toString() {
        StringBuilder text = new StringBuilder("DataRegistry[");
        for (int k = 0; k < providers.size(); k++) {
            Ranked ranked = providers.get(k);
            text.append(k == 0 ? "" : ", ").append(ranked.origin().name().toLowerCase(java.util.Locale.ROOT)
                    .replace('_', '-')).append(' ').append(ranked.provider().id());
        }
        return text.append(']').toString();
    }
}
