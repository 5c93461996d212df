package org.microtally.notebook.render;

/**
 * Prepares the JVM for drawing and table work inside a notebook, before AWT or the table library
 * initialise. Every class here that draws or builds tables calls {@link #prepare()} first; the
 * engine may call it earlier. Settings the user made explicitly are left alone.
 *
 * <ul>
 *   <li>{@code java.awt.headless=true}: charts and images are only ever drawn into memory, and a
 *       machine without a display must work.</li>
 *   <li>{@code slf4j.internal.verbosity=ERROR}: the table library logs through SLF4J; with no
 *       logging backend on the class path SLF4J would print a three-line warning into the first cell
 *       that touches a table.</li>
 * </ul>
 */
public final class DisplayEnvironment {
    private DisplayEnvironment() { }

    /** Applies the settings above where unset; returns whether AWT is (or will be) headless. */
    public static synchronized boolean prepare() {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
        if (System.getProperty("slf4j.internal.verbosity") == null) {
            System.setProperty("slf4j.internal.verbosity", "ERROR");
        }
        return Boolean.parseBoolean(System.getProperty("java.awt.headless"));
    }
}
