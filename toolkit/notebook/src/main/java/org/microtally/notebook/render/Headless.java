package org.microtally.notebook.render;

/**
 * Makes AWT usable for off-screen drawing on a machine without a display. Charts and images are
 * only ever drawn into memory, so {@code java.awt.headless=true} is set unless the user set the
 * property explicitly. It must happen before AWT initialises; every class here that draws calls
 * {@link #ensure()} first.
 */
public final class Headless {
    private Headless() { }

    /** Sets {@code java.awt.headless=true} when the property is unset; returns the value in force. */
    public static synchronized boolean ensure() {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
        return Boolean.parseBoolean(System.getProperty("java.awt.headless"));
    }
}
