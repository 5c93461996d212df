package org.microtally.notebook.session;

import java.util.Map;
import java.util.Objects;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicLong;
import org.microtally.ProgressListener;
import org.microtally.notebook.render.Markup;
import org.microtally.notebook.render.MimeBundle;
import org.microtally.notebook.render.Renderers;

/**
 * Display helpers for cell code; every session imports them statically, so a cell writes
 * {@code show(result)}, {@code html("<b>...</b>")} or {@code progress("levels")}.
 *
 * <p>The output goes to the cell that is running on the calling thread (or, from threads a cell
 * did not start, to the only running cell). Outside any running cell the plain-text form is
 * printed on the process's standard output.
 *
 * <p>Values are rendered by the registry of the engine that runs the cell ({@link #renderers()}):
 * each engine owns one, made with {@link Renderers#withBuiltIns()} when it starts, so a renderer a
 * notebook adds with {@code renderers().put(MyResult.class, r -> ...)} changes that notebook's
 * displays only. Outside any engine the shared {@link Renderers#standard()} registry is used.
 */
public final class Display {
    /** Display ids of {@link #progress} displays start with this prefix (for uniqueness only; front ends get {@link CellOutput#progress}). */
    static final String PROGRESS_ID_PREFIX = "mt-progress-";
    private static final AtomicLong IDS = new AtomicLong();
    /** Each engine's registry, keyed by the thread group its cells run in (attached while the engine is open). */
    private static final Map<ThreadGroup, Renderers> REGISTRIES = new ConcurrentHashMap<>();

    private Display() { }

    /** Makes {@code registry} the one used for cells running in {@code cells} (called by the engine at start). */
    static void attach(ThreadGroup cells, Renderers registry) {
        REGISTRIES.put(Objects.requireNonNull(cells, "cells"), Objects.requireNonNull(registry, "registry"));
    }

    /** Forgets the registry of a closed engine. */
    static void detach(ThreadGroup cells) {
        REGISTRIES.remove(cells);
    }

    /**
     * The renderer registry of the engine running the current cell (add renderers for your own
     * types with {@code renderers().put(Type.class, value -> bundle)}); outside an engine the shared
     * default registry.
     */
    public static Renderers renderers() {
        CellContext c = OutputRouter.current();
        Renderers r = c == null ? null : REGISTRIES.get(c.group);
        return r != null ? r : Renderers.standard();
    }

    /** Shows {@code value} as rendered by the {@linkplain #renderers() engine's registry} (table, chart, text...). */
    public static void show(Object value) {
        emit(renderers().display(value), null, false);
    }

    /** Shows a ready-made MIME bundle. */
    public static void show(MimeBundle bundle) {
        emit(Objects.requireNonNull(bundle, "bundle"), null, false);
    }

    /** Shows an HTML fragment (plain-text fallback: the fragment with its tags removed). */
    public static void html(String html) {
        Objects.requireNonNull(html, "html");
        String text = Markup.plainText(html);
        emit(MimeBundle.builder(text.isBlank() ? html : text).put(MimeBundle.TEXT_HTML, html).build(), null, false);
    }

    /** Shows Markdown text (plain-text fallback: the source itself). */
    public static void markdown(String markdown) {
        Objects.requireNonNull(markdown, "markdown");
        emit(MimeBundle.builder(markdown).put(MimeBundle.TEXT_MARKDOWN, markdown).build(), null, false);
    }

    /** Shows a LaTeX formula, e.g. {@code latex("$Z = \\sum_i g_i e^{-\\beta E_i}$")}. */
    public static void latex(String latex) {
        Objects.requireNonNull(latex, "latex");
        emit(MimeBundle.builder(latex).put(MimeBundle.TEXT_LATEX, latex).build(), null, false);
    }

    /**
     * A progress listener for a long computation: shows a display now and updates it in place,
     * at most {@value ProgressDisplay#MIN_INTERVAL_MS} ms apart and at most
     * {@value ProgressDisplay#MAX_UPDATES} times, always including the final report (done == total).
     */
    public static ProgressListener progress(String label) {
        Objects.requireNonNull(label, "label");
        ProgressDisplay p = new ProgressDisplay(label, PROGRESS_ID_PREFIX + IDS.incrementAndGet(), OutputRouter.current());
        p.start();
        return p;
    }

    static void emit(MimeBundle bundle, String id, boolean update) {
        emitTo(OutputRouter.current(), bundle, id, update, false);
    }

    static void emitTo(CellContext context, MimeBundle bundle, String id, boolean update, boolean progress) {
        if (context != null) {
            context.display(bundle, id, update, progress);
        } else {
            OutputRouter.CONSOLE_OUT.println(bundle.plain());
        }
    }
}
