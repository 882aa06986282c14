package org.ritzwerk.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import org.apache.spark.SparkEnv;
import org.apache.spark.SparkExecutorInfo;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.scheduler.SparkListener;
import org.apache.spark.scheduler.SparkListenerTaskEnd;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.junit.jupiter.api.io.TempDir;

/**
 * The three operations on a Spark standalone deployment of several processes ({@link
 * StandaloneCluster}: a master, a worker and two executors of one core, each its own JVM, all on
 * 127.0.0.1), where the local-mode tests' single JVM hides nothing: every task, broadcast line set
 * and parameter record is serialised and shipped to another process, and every refusal comes back
 * from one. The checks are the local-mode tests' own ({@link SurveyIdentificationTest}, {@link
 * SurveyCalibrationTest}, {@link SurveySynthesisTest}), every output double compared with the
 * library called directly in this JVM, exactly. First it asserts that the tasks really run in
 * other processes: two executors, whose tasks report two process ids, neither of them the driver's,
 * both children of the worker this test started; and after each operation, that its tasks ran on
 * those executors.
 *
 * <p>Runs in a JVM of its own (the surefire execution {@code standalone-cluster} in
 * {@code spark/pom.xml}), since a JVM holds one SparkContext and the other tests share a local one.
 * A cluster that does not start fails the test with the master's and worker's logs; it is never
 * skipped.
 */
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class SurveyClusterTest {

    private static final int EXECUTORS = 2;

    private static StandaloneCluster cluster;
    /** The executor id of every task that ended, as the driver's scheduler reports it. */
    private static final Set<String> TASK_EXECUTORS = ConcurrentHashMap.newKeySet();
    private static final AtomicInteger TASKS = new AtomicInteger();

    @BeforeAll
    static void startCluster() throws Exception {
        cluster = StandaloneCluster.start(EXECUTORS, 512);
        cluster.session().sparkContext().addSparkListener(new SparkListener() {
            @Override
            public void onTaskEnd(SparkListenerTaskEnd end) {
                TASK_EXECUTORS.add(end.taskInfo().executorId());
                TASKS.incrementAndGet();
            }
        });
    }

    @AfterAll
    static void stopCluster() {
        if (cluster != null) {
            cluster.close();
        }
    }

    /** Two executors, two processes, neither the driver's JVM, both among the worker's child processes. */
    @Test
    @Order(1)
    void tasksRunInTwoExecutorProcessesApartFromTheDriver() {
        SparkSession spark = cluster.session();
        assertEquals(cluster.url(), spark.sparkContext().master());
        assertSeparateProcesses(spark, EXECUTORS, cluster.pids());
    }

    /**
     * Runs eight tasks, each reporting its executor's id and its JVM's process id (each task waits
     * 200 ms, so that one executor cannot take all eight before the other starts), and asserts
     * that the session has {@code executors} executors besides the driver, that the tasks ran on
     * that many, in that many processes, none of them this JVM, all among {@code childPids} (the
     * processes the test started). {@link LocalSparkIsNotAClusterTest} shows it refuses local mode.
     */
    static void assertSeparateProcesses(SparkSession spark, int executors, List<Long> childPids) {
        SparkExecutorInfo[] infos = spark.sparkContext().statusTracker().getExecutorInfos();
        List<String> seen = JavaSparkContext.fromSparkContext(spark.sparkContext())
                .parallelize(List.of(0, 1, 2, 3, 4, 5, 6, 7), 8)
                .map(k -> {
                    Thread.sleep(200);
                    return SparkEnv.get().executorId() + " " + ProcessHandle.current().pid();
                })
                .collect();
        assertEquals(executors + 1, infos.length, "the driver and " + executors + " executors");
        Set<String> executorIds = new TreeSet<>();
        Set<Long> pids = new TreeSet<>();
        for (String s : seen) {
            executorIds.add(s.split(" ")[0]);
            pids.add(Long.parseLong(s.split(" ")[1]));
        }
        assertEquals(executors, executorIds.size(), "executors that ran tasks: " + seen);
        assertFalse(executorIds.contains("driver"), seen.toString());
        assertEquals(executors, pids.size(), "processes that ran tasks: " + seen);
        assertFalse(pids.contains(ProcessHandle.current().pid()), "a task ran in the driver's JVM: " + seen);
        assertTrue(childPids.containsAll(pids), "the executors are the worker's children " + childPids + ": " + seen);
    }

    @Test
    @Order(2)
    void identificationIsTheLibrarysBitForBit() throws InterruptedException {
        int before = TASKS.get();
        SurveyIdentificationTest.fixedWindowGivesTheLibrarysNumbersBitForBit(cluster.session());
        SurveyIdentificationTest.windowPerSpectrumIsTheIdentifyCommandsComposition(cluster.session());
        assertTasksRanOnTheExecutors(before);
    }

    @Test
    @Order(3)
    void calibrationAndItsApplicationAreTheLibrarysBitForBit(@TempDir Path folder) throws Exception {
        int before = TASKS.get();
        SurveyCalibrationTest.calibrationsAndTheirApplicationAreTheLibrarysBitForBit(cluster.session(), folder);
        assertTasksRanOnTheExecutors(before);
    }

    @Test
    @Order(4)
    void synthesisIsTheLibrarysBitForBit(@TempDir Path folder) throws Exception {
        int before = TASKS.get();
        SurveySynthesisTest.spectraAndTruthAreTheLibrarysBitForBit(cluster.session());
        SurveySynthesisTest.lampScenesOnADispersionGridAreTheLibrarysBitForBit(cluster.session(), folder);
        assertTasksRanOnTheExecutors(before);
    }

    /**
     * Tasks ended since {@code before} (the scheduler's events reach the listener shortly after a
     * job ends, so this waits up to 10 s for the first), and every task so far ran on one of the
     * cluster's executors, never in the driver.
     */
    private static void assertTasksRanOnTheExecutors(int before) throws InterruptedException {
        long deadline = System.nanoTime() + 10_000_000_000L;
        while (TASKS.get() == before && System.nanoTime() < deadline) {
            Thread.sleep(50);
        }
        assertTrue(TASKS.get() > before, "no task ended");
        Set<String> ids = new TreeSet<>(TASK_EXECUTORS);
        assertFalse(ids.contains("driver"), "a task ran in the driver: " + ids);
        assertEquals(EXECUTORS, ids.size(), "the executors that ran tasks: " + ids);
    }
}
