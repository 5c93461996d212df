package org.microtally.notebook.session;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.stream.Collectors;

/**
 * What a notebook records about the kernel that ran it: the kernelspec names and the
 * {@code language_info} block. One source of truth for both front doors: the kernel's
 * {@code kernel_info_reply} and the headless runner's saved notebook metadata.
 *
 * <p>The {@code language_info} values follow the JDK's own conventions: the language is
 * {@code java}; files are {@code .java} with the MIME type {@code text/x-java-source} (the type the
 * JDK's {@code javax.tools} and common web servers give Java sources); the syntax lexer is
 * {@code java} for both Pygments and CodeMirror (CodeMirror finds its Java mode by that name). The
 * version is the running JVM's version number in the form of {@link Runtime.Version#version()}
 * (feature.interim.update.patch, e.g. {@code 17.0.15}, without the build and vendor suffix): the
 * exact release a colleague needs to reproduce numbers, while the feature release alone (17) would
 * hide update releases that change floating-point library results ({@code StrictMath} is stable,
 * {@code Math} intrinsics are not).
 */
public final class KernelIdentity {
    /** The kernelspec name (kept for compatibility with installed kernels and saved notebooks). */
    public static final String KERNEL_NAME = "microtally";
    /** The name Jupyter shows in its kernel menu. */
    public static final String DISPLAY_NAME = "microtally \u2014 exact counts";
    /** The kernelspec name of the kernel with the Spark module on its class path. */
    public static final String SPARK_KERNEL_NAME = "microtally-spark";
    /** Its display name. */
    public static final String SPARK_DISPLAY_NAME = "microtally \u2014 exact counts on Spark";
    /**
     * The system property in which the launcher lists, separated like a class path, the class-path entries
     * it added for Spark (the Spark module's jar and Spark's jars) when it put Spark on the class path.
     */
    public static final String SPARK_CLASSPATH_PROPERTY = "microtally.spark.classpath";
    /** The language name in kernel.json and language_info. */
    public static final String LANGUAGE = "java";
    public static final String MIMETYPE = "text/x-java-source";
    public static final String FILE_EXTENSION = ".java";
    public static final String LEXER = "java";

    private KernelIdentity() { }

    /** The running JVM's version number, e.g. {@code 17.0.15} (see the class description). */
    public static String javaVersion() {
        return Runtime.version().version().stream().map(String::valueOf).collect(Collectors.joining("."));
    }

    /**
     * The nbformat / messaging-protocol {@code language_info} fields, in a fixed order: name,
     * version, mimetype, file_extension, pygments_lexer, codemirror_mode.
     */
    public static Map<String, String> languageInfo() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("name", LANGUAGE);
        m.put("version", javaVersion());
        m.put("mimetype", MIMETYPE);
        m.put("file_extension", FILE_EXTENSION);
        m.put("pygments_lexer", LEXER);
        m.put("codemirror_mode", LEXER);
        return m;
    }
}
