package org.ritzwerk.spark;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.stream.Stream;
import org.apache.spark.sql.SparkSession;

/**
 * A Spark standalone deployment on this machine, every part of it its own process and every
 * socket on the loopback interface: a master ({@code org.apache.spark.deploy.master.Master}) and
 * one worker ({@code org.apache.spark.deploy.worker.Worker}) started as child JVMs, the worker
 * starting one executor JVM per executor, and a driver session in this JVM that connects to the
 * master at {@code spark://127.0.0.1:port}, as {@code spark-submit --master spark://...} does.
 * Tasks, broadcasts and parameter records therefore travel between processes, serialised (Kryo as
 * the serializer, as in {@link LocalSpark}).
 *
 * <p>Spark's worker starts executors with the launcher of a Spark installation: it needs a Spark
 * home with a {@code jars} folder. This class makes a temporary one with an empty {@code jars}
 * folder and gives every process the test JVM's class path instead (the master and worker with
 * {@code -cp}, the executors with {@code spark.executor.extraClassPath}), so the executors load
 * Spark, the Ritzwerk modules and these tests' classes from where the driver loads them. The JVM
 * options Spark needs on Java 17 ({@code spark.jvm.options} in {@code spark/pom.xml}, passed in the
 * system property {@value #JVM_OPTIONS}) go to every process. {@link #close()} stops the session,
 * the worker with its executors and the master, and deletes the temporary folder. Only one
 * SparkContext may live in a JVM, so a test using this class runs in its own JVM (the surefire
 * execution {@code standalone-cluster} in {@code spark/pom.xml}).
 */
final class StandaloneCluster implements AutoCloseable {

    /** The system property with the JVM options of every Spark process (set by spark/pom.xml). */
    static final String JVM_OPTIONS = "ritzwerk.spark.jvm.options";

    private static final String LOOPBACK = "127.0.0.1";
    /** How long the master, the worker and the executors may take to start. */
    private static final long START_SECONDS = 90;

    private final Path home;
    private final List<Process> processes = new ArrayList<>();
    private SparkSession session;
    private String url;

    private StandaloneCluster(Path home) {
        this.home = home;
    }

    /**
     * Starts a master, a worker with {@code executors} cores and a session of that many
     * executors of one core and {@code executorMegabytes} each, and waits until every executor has
     * registered with the driver.
     *
     * @throws IllegalStateException naming what did not start, with the end of its log
     */
    static StandaloneCluster start(int executors, int executorMegabytes) throws IOException {
        String classPath = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        String options = System.getProperty(JVM_OPTIONS);
        if (options == null || options.isBlank()) {
            throw new IllegalStateException("the system property " + JVM_OPTIONS + " is not set: it carries the JVM"
                    + " options every Spark process needs on Java 17 (spark/pom.xml passes spark.jvm.options)");
        }
        StandaloneCluster cluster = new StandaloneCluster(Files.createTempDirectory("ritzwerk-spark-home"));
        try {
            cluster.launch(classPath, options, executors, executorMegabytes);
            return cluster;
        } catch (RuntimeException | IOException | Error e) {
            cluster.close();
            throw e;
        }
    }

    private void launch(String classPath, String options, int executors, int executorMegabytes) throws IOException {
        // The worker's launcher needs SPARK_HOME/jars to exist (CommandBuilderUtils.findJarsDir).
        Files.createDirectories(home.resolve("jars"));
        Path work = Files.createDirectories(home.resolve("work"));
        int port = freePort();
        url = "spark://" + LOOPBACK + ":" + port;
        // No REST submission server (it would take the fixed port 6066).
        processes.add(spawn("master", classPath, options + " -Dspark.master.rest.enabled=false", List.of(
                "org.apache.spark.deploy.master.Master",
                "--host", LOOPBACK, "--port", Integer.toString(port), "--webui-port", "0")));
        awaitPort(port, "master");
        processes.add(spawn("worker", classPath, options, List.of("org.apache.spark.deploy.worker.Worker",
                "--host", LOOPBACK, "--port", "0", "--webui-port", "0", "--cores", Integer.toString(executors),
                "--memory", executors * executorMegabytes + "m", "--work-dir", work.toString(), url)));
        session = SparkSession.builder()
                .master(url)
                .appName("ritzwerk-spark-cluster-test")
                .config("spark.ui.enabled", "false")
                .config("spark.driver.host", LOOPBACK)
                .config("spark.driver.bindAddress", LOOPBACK)
                .config("spark.executor.cores", "1")
                .config("spark.cores.max", Integer.toString(executors))
                .config("spark.executor.memory", executorMegabytes + "m")
                .config("spark.executor.extraClassPath", classPath)
                // Each executor computes for seconds only: the quick compiler alone (C1) spends far less
                // CPU on compiling; Java's arithmetic is the same in every compiler tier, and the outputs
                // are still compared bit for bit with the driver's own calls.
                .config("spark.executor.extraJavaOptions", options + " -XX:TieredStopAtLevel=1")
                .config("spark.executorEnv.SPARK_LOCAL_IP", LOOPBACK)
                .config("spark.sql.shuffle.partitions", "2")
                .config("spark.task.maxFailures", "1")
                .config("spark.sql.debug.maxToStringFields", "200")
                .config("spark.serializer", "org.apache.spark.serializer.KryoSerializer")
                .getOrCreate();
        if (!session.sparkContext().master().equals(url)) {
            throw new IllegalStateException("a Spark session already runs in this JVM (" + session.sparkContext()
                    .master() + "), and a JVM holds one: run SurveyClusterTest alone (-Dtest=SurveyClusterTest) or"
                    + " by mvn verify, whose surefire execution standalone-cluster gives it a JVM of its own");
        }
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(START_SECONDS);
        // The status tracker lists the driver too.
        while (session.sparkContext().statusTracker().getExecutorInfos().length < executors + 1) {
            if (System.nanoTime() > deadline) {
                throw new IllegalStateException(executors + " executors did not register within " + START_SECONDS
                        + " s (" + (session.sparkContext().statusTracker().getExecutorInfos().length - 1)
                        + " did)\n" + logs());
            }
            sleep(100);
        }
    }

    /** The session connected to the master. */
    SparkSession session() {
        return session;
    }

    /** The master's URL, {@code spark://127.0.0.1:port}. */
    String url() {
        return url;
    }

    /** The process ids of the master, the worker and the worker's executors, this JVM's children. */
    List<Long> pids() {
        List<Long> pids = new ArrayList<>();
        for (Process p : processes) {
            pids.add(p.pid());
            p.descendants().forEach(d -> pids.add(d.pid()));
        }
        return pids;
    }

    private Process spawn(String name, String classPath, String options, List<String> mainAndArguments)
            throws IOException {
        List<String> command = new ArrayList<>();
        command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        // The master and worker only pass messages: a small heap, and the quick compiler alone.
        command.addAll(List.of("-Xmx256m", "-XX:TieredStopAtLevel=1", "-XX:+UseSerialGC"));
        command.addAll(List.of(options.trim().split("\\s+")));
        command.add("-cp");
        command.add(classPath);
        command.addAll(mainAndArguments);
        ProcessBuilder builder = new ProcessBuilder(command).redirectErrorStream(true)
                .redirectOutput(home.resolve(name + ".log").toFile());
        builder.environment().put("SPARK_HOME", home.toString());
        builder.environment().put("SPARK_LOCAL_IP", LOOPBACK);
        // The launcher asks for the Scala version of the Spark home (a built Spark tree has it in a folder name).
        builder.environment().put("SPARK_SCALA_VERSION", "2.13");
        return builder.start();
    }

    private void awaitPort(int port, String name) {
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(START_SECONDS);
        while (true) {
            try (Socket socket = new Socket()) {
                socket.connect(new InetSocketAddress(LOOPBACK, port), 1000);
                return;
            } catch (IOException notYet) {
                if (System.nanoTime() > deadline || !processes.get(processes.size() - 1).isAlive()) {
                    throw new IllegalStateException("the " + name + " did not listen on " + LOOPBACK + ":" + port
                            + " within " + START_SECONDS + " s\n" + logs());
                }
                sleep(100);
            }
        }
    }

    /** The end of each process's log, for a failure message. */
    private String logs() {
        StringBuilder text = new StringBuilder();
        for (String name : List.of("master", "worker")) {
            Path log = home.resolve(name + ".log");
            try {
                List<String> lines = Files.exists(log) ? Files.readAllLines(log) : List.of();
                text.append("--- ").append(name).append(" log (last 30 lines) ---\n");
                lines.subList(Math.max(0, lines.size() - 30), lines.size()).forEach(l -> text.append(l).append('\n'));
            } catch (IOException e) {
                text.append("--- ").append(name).append(" log unreadable: ").append(e).append('\n');
            }
        }
        return text.toString();
    }

    private static int freePort() throws IOException {
        try (ServerSocket socket = new ServerSocket()) {
            socket.bind(new InetSocketAddress(LOOPBACK, 0));
            return socket.getLocalPort();
        }
    }

    private static void sleep(long millis) {
        try {
            Thread.sleep(millis);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while the cluster started", e);
        }
    }

    /** Stops the session, then the worker with its executors and the master, and deletes the Spark home. */
    @Override
    public void close() {
        try {
            if (session != null) {
                session.stop();
            }
        } finally {
            for (int k = processes.size() - 1; k >= 0; k--) {
                stop(processes.get(k));
            }
            deleteTree(home);
        }
    }

    private static void stop(Process process) {
        List<ProcessHandle> children = process.descendants().toList();
        children.forEach(ProcessHandle::destroy);
        process.destroy();
        try {
            if (!process.waitFor(15, TimeUnit.SECONDS)) {
                process.destroyForcibly().waitFor(5, TimeUnit.SECONDS);
            }
            for (ProcessHandle child : children) {
                try {
                    child.onExit().get(10, TimeUnit.SECONDS);
                } catch (ExecutionException | TimeoutException e) {
                    child.destroyForcibly();
                }
            }
        } catch (InterruptedException e) {
            process.destroyForcibly();
            children.forEach(ProcessHandle::destroyForcibly);
            Thread.currentThread().interrupt();
        }
    }

    private static void deleteTree(Path root) {
        if (!Files.exists(root)) {
            return;
        }
        try (Stream<Path> paths = Files.walk(root)) {
            for (Path p : paths.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("could not delete the temporary Spark home " + root, e);
        }
    }
}
