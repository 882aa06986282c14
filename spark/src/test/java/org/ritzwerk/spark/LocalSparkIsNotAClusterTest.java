package org.ritzwerk.spark;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.opentest4j.AssertionFailedError;

/**
 * {@link SurveyClusterTest}'s check that tasks run in executor processes apart from the driver
 * fails in local mode, where the tasks run in the driver's JVM: so the cluster test would notice
 * a deployment whose executors were not separate processes.
 */
class LocalSparkIsNotAClusterTest {

    @Test
    void theSeparateProcessCheckRefusesLocalMode() {
        AssertionFailedError refused = assertThrows(AssertionFailedError.class,
                () -> SurveyClusterTest.assertSeparateProcesses(LocalSpark.session(), 2, List.of()));
        assertTrue(refused.getMessage().startsWith("the driver and 2 executors"), refused.getMessage());
        // Asked for no executor, local mode passes the count and fails on where the tasks ran.
        refused = assertThrows(AssertionFailedError.class,
                () -> SurveyClusterTest.assertSeparateProcesses(LocalSpark.session(), 0, List.of()));
        assertTrue(refused.getMessage().startsWith("executors that ran tasks: [driver "), refused.getMessage());
    }
}
