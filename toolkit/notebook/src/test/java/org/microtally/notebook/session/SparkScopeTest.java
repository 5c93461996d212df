package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/**
 * A notebook for the plain kernel compiles without the class-path entries the launcher added for Spark,
 * a notebook for the Spark kernel with them. A test jar (opentest4j, on the test class path and not part of
 * the engine) stands in for Spark's jars: it is named in {@link KernelIdentity#SPARK_CLASSPATH_PROPERTY}.
 */
@Timeout(value = 60, unit = TimeUnit.SECONDS)
class SparkScopeTest {
    private static final String CELL = "org.opentest4j.TestAbortedException standIn = new org.opentest4j.TestAbortedException(\"x\");\nstandIn.getMessage()";

    @AfterEach
    void clearProperty() {
        System.clearProperty(KernelIdentity.SPARK_CLASSPATH_PROPERTY);
    }

    private static String standInJar() throws Exception {
        return Path.of(org.opentest4j.TestAbortedException.class.getProtectionDomain().getCodeSource().getLocation().toURI())
                .toAbsolutePath().normalize().toString();
    }

    @Test
    void thePlainClassPathLeavesOutTheEntriesNamedForSpark() throws Exception {
        String jar = standInJar();
        assertTrue(EngineClassPath.classPath(false).contains(jar), "without the property nothing is left out");
        System.setProperty(KernelIdentity.SPARK_CLASSPATH_PROPERTY, "/nowhere/spark-core.jar" + java.io.File.pathSeparator + jar);
        assertFalse(EngineClassPath.classPath(false).contains(jar));
        assertTrue(EngineClassPath.classPath(true).contains(jar));
        // the engine's own classes stay on both
        assertEquals(EngineClassPath.classPath(true).size() - 1, EngineClassPath.classPath(false).size());
    }

    @Test
    void eachKernelNameGetsTheClassPathOfItsKernel() throws Exception {
        System.setProperty(KernelIdentity.SPARK_CLASSPATH_PROPERTY, standInJar());
        try (Engine spark = Session.forKernel(KernelIdentity.SPARK_KERNEL_NAME).open()) {
            CellResult r = spark.run(CELL, CellOutput.DISCARD);
            assertTrue(r.ok(), () -> r.error().toString());
            assertEquals("x", r.raw().orElseThrow());
        }
        for (String plain : new String[] {KernelIdentity.KERNEL_NAME, "some-other-kernel"}) {
            try (Engine engine = Session.forKernel(plain).open()) {
                CellResult r = engine.run(CELL, CellOutput.DISCARD);
                assertFalse(r.ok(), plain + ": the stand-in jar was on the compile class path");
                assertTrue(r.error().orElseThrow().toString().contains("org.opentest4j"), () -> r.error().toString());
            }
        }
    }
}
