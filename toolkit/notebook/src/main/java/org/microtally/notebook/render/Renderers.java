package org.microtally.notebook.render;

import java.awt.image.BufferedImage;
import java.lang.reflect.Array;
import java.math.BigInteger;
import java.util.ArrayDeque;
import java.util.Collection;
import java.util.Deque;
import java.util.HashSet;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.function.Function;
import org.apache.commons.math3.fraction.BigFraction;
import org.microtally.Tabular;
import org.microtally.spectrum.Spectrum;
import org.microtally.units.Energy;
import org.microtally.units.EnergyUnit;
import org.knowm.xchart.internal.chartpart.Chart;
import tech.tablesaw.api.Table;

/**
 * Turns any value into a {@link MimeBundle}: the single entry point the evaluation engine, the
 * kernel and the headless runner use for display. Every bundle has {@code text/plain}.
 *
 * <p>Dispatch is one registry keyed by class. For a value of class {@code C} the renderer registered
 * for {@code C} is used, else the one for its nearest superclass, else for the first of its
 * interfaces found breadth-first (own interfaces before inherited ones). Arrays and {@code null} are
 * handled before the registry. Built in:
 * <ul>
 *   <li>{@link MimeBundle}: as is; {@link Html}, {@link Markdown}, {@link Latex}: their MIME type
 *       plus a plain fallback;</li>
 *   <li>{@link Tabular} and Tablesaw {@link Table}: aligned text and an HTML table
 *       ({@link TableDisplay}), captioned by the value's short {@code toString()} or class name
 *       (Tablesaw: the table name);</li>
 *   <li>{@link Spectrum}: its levels as a table with a summary caption and the cutoff note;</li>
 *   <li>{@link Energy}: text and LaTeX; {@link BigFraction}: {@code p/q} and a LaTeX fraction;</li>
 *   <li>XChart charts: PNG and SVG; {@link BufferedImage}: PNG;</li>
 *   <li>arrays, {@link Collection}s and {@link Map}s: plain text, at most {@value #MAX_ELEMENTS}
 *       elements, with the total size when more;</li>
 *   <li>anything else: {@code String.valueOf}; {@code null}: the text {@code null}.</li>
 * </ul>
 * A String is always plain text (wrap it in {@link Html} to have it shown as markup).
 *
 * <p>If a renderer throws, a {@link Tabular} value is shown by the generic table display and any
 * other value by {@code String.valueOf}, with a line saying that rendering failed and why, so a
 * display problem never hides the value or fails the cell.
 *
 * <p>A registry is an object: {@link #withBuiltIns()} makes a fresh one (an engine can own its own
 * and add renderers without touching any other), and the static {@link #render(Object)} and
 * {@link #register} work on one shared default instance, {@link #standard()}, for code outside an
 * engine; every evaluation engine owns its own registry. Creating a registry
 * prepares the JVM for drawing once ({@link DisplayEnvironment#prepare()}).
 */
public final class Renderers {
    /** Elements of an array or collection shown in plain text before the rest is summarised. */
    public static final int MAX_ELEMENTS = 100;

    private static final class Default {
        static final Renderers INSTANCE = withBuiltIns();
    }

    private final Map<Class<?>, Function<Object, MimeBundle>> registry = new ConcurrentHashMap<>();

    private Renderers() {
        DisplayEnvironment.prepare();
    }

    /** A new registry holding the built-in renderers listed above. */
    public static Renderers withBuiltIns() {
        Renderers r = new Renderers();
        r.put(MimeBundle.class, b -> b);
        r.put(Html.class, h -> MimeBundle.builder(h.text()).put(MimeBundle.TEXT_HTML, h.markup()).build());
        r.put(Markdown.class, m -> MimeBundle.builder(m.source()).put(MimeBundle.TEXT_MARKDOWN, m.source()).build());
        r.put(Latex.class, l -> MimeBundle.builder(l.source()).put(MimeBundle.TEXT_LATEX, l.source()).build());
        r.put(Tabular.class, t -> TableDisplay.bundle(t, caption(t), List.of()));
        r.put(Tables.AllRows.class, a -> TableDisplay.bundle(a.table(), caption(a.table()), List.of(),
                TableFormat.DEFAULT.allRows()));
        r.put(Table.class, t -> TableDisplay.bundle(Tables.asTabular(t), t.name(), List.of()));
        r.put(Spectrum.class, Renderers::spectrum);
        r.put(Energy.class, Renderers::energy);
        r.put(BigFraction.class, Renderers::fraction);
        r.put(Chart.class, Charts::bundle);
        r.put(BufferedImage.class, Charts::bundle);
        r.put(Collection.class, c -> MimeBundle.text(collection(c)));
        r.put(Map.class, m -> MimeBundle.text(map(m)));
        ResultDisplays.registerAll(r);
        LimitDisplays.registerAll(r);
        EnsembleDisplays.registerAll(r);
        return r;
    }

    /** The shared default registry used by the static {@link #render(Object)} and {@link #register}. */
    public static Renderers standard() {
        return Default.INSTANCE;
    }

    /**
     * Registers (or replaces) the renderer for values of {@code type} and its subtypes that have no
     * more specific renderer, in this registry. Thread-safe; takes effect for the next display.
     */
    public <T> Renderers put(Class<T> type, Function<? super T, MimeBundle> renderer) {
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(renderer, "renderer");
        registry.put(type, v -> renderer.apply(type.cast(v)));
        return this;
    }

    /**
     * Registers a renderer in the {@linkplain #standard() default registry} (see {@link #put}), used by
     * code outside an engine. A notebook cell's displays come from its engine's own registry: there,
     * use {@code renderers().put(...)} (the session's display helpers).
     */
    public static <T> void register(Class<T> type, Function<? super T, MimeBundle> renderer) {
        standard().put(type, renderer);
    }

    /** The bundle for {@code value} from the default registry (never null; {@code null} renders as "null"). */
    public static MimeBundle render(Object value) {
        return standard().display(value);
    }

    /** The bundle for {@code value} from this registry (never null; {@code null} renders as the text "null"). */
    public MimeBundle display(Object value) {
        if (value == null) {
            return MimeBundle.text("null");
        }
        try {
            if (value.getClass().isArray()) {
                return MimeBundle.text(array(value));
            }
            Function<Object, MimeBundle> r = lookup(value.getClass());
            MimeBundle b = r == null ? null : r.apply(value);
            return b != null ? b : MimeBundle.text(String.valueOf(value));
        } catch (RuntimeException | LinkageError e) {
            return failed(value, e);
        }
    }

    private static MimeBundle failed(Object value, Throwable e) {
        if (value instanceof Tabular t) {
            try {
                MimeBundle generic = TableDisplay.bundle(t, caption(t), List.of());
                MimeBundle.Builder b = MimeBundle.builder(generic.plain() + "\n(rich display failed: " + e
                        + "; shown as a plain table)");
                generic.data().forEach((k, v) -> {
                    if (!k.equals(MimeBundle.TEXT_PLAIN)) {
                        b.put(k, v);
                    }
                });
                return b.build();
            } catch (RuntimeException ignored) {
                // the table itself cannot be shown: fall through to text
            }
        }
        String plain;
        try {
            plain = String.valueOf(value);
        } catch (RuntimeException e2) {
            plain = value.getClass().getName();
        }
        return MimeBundle.text(plain + "\n(rich display failed: " + e + ")");
    }

    private Function<Object, MimeBundle> lookup(Class<?> type) {
        for (Class<?> c = type; c != null; c = c.getSuperclass()) {
            Function<Object, MimeBundle> r = registry.get(c);
            if (r != null) {
                return r;
            }
        }
        Deque<Class<?>> queue = new ArrayDeque<>();
        Set<Class<?>> seen = new HashSet<>();
        for (Class<?> c = type; c != null; c = c.getSuperclass()) {
            queue.addAll(List.of(c.getInterfaces()));
        }
        while (!queue.isEmpty()) {
            Class<?> i = queue.removeFirst();
            if (!seen.add(i)) {
                continue;
            }
            Function<Object, MimeBundle> r = registry.get(i);
            if (r != null) {
                return r;
            }
            queue.addAll(List.of(i.getInterfaces()));
        }
        return null;
    }

    private static final java.util.regex.Pattern OBJECT_HASH = java.util.regex.Pattern.compile("\\w@[0-9a-f]{5,8}\\b");

    /** Longest {@code toString()} used as a table caption. */
    static final int MAX_CAPTION = 160;

    /**
     * The caption of a generic table: the value's own {@code toString()} when its class defines one,
     * it shows no object hash, and it is short (at most {@value #MAX_CAPTION} characters, one line), else its class's simple
     * name (none for anonymous classes).
     */
    static String caption(Object value) {
        try {
            if (value.getClass().getMethod("toString").getDeclaringClass() != Object.class) {
                String s = value.toString();
                // an object hash (ClassName@1b6d3586, as in a record holding a value without its own
                // toString) says nothing to a reader: not a caption
                if (s != null && s.length() <= MAX_CAPTION && s.indexOf('\n') < 0 && !OBJECT_HASH.matcher(s).find()) {
                    return s;
                }
            }
        } catch (NoSuchMethodException | RuntimeException e) {
            // fall through to the class name
        }
        return value.getClass().getSimpleName();
    }

    private static MimeBundle spectrum(Spectrum s) {
        String caption = String.format("Spectrum: %,d levels, %,d states, energies in %s%s", s.size(), s.stateCount(),
                s.scale().name(), s.isTruncated() ? ", cut off above " + CellText.floating(s.cutoffEnergy(), 12) : "");
        List<String> notes = s.cutoffNote().isBlank() ? List.of() : List.of("Cutoff: " + s.cutoffNote());
        return TableDisplay.bundle(Tables.levels(s), caption, notes);
    }

    private static MimeBundle energy(Energy e) {
        EnergyUnit u = e.displayUnit();
        String unit = switch (u) {
            case WAVENUMBER -> "\\mathrm{cm}^{-1}";
            default -> "\\mathrm{" + u.symbol() + "}";
        };
        String number = CellText.floating(e.in(u), 17);
        String mantissa = number.contains("e")
                ? number.replaceFirst("e(-?[0-9]+)$", " \\\\times 10^{$1}") : number;
        return MimeBundle.builder(e.toString()).put(MimeBundle.TEXT_LATEX, "$" + mantissa + "\\ " + unit + "$").build();
    }

    private static MimeBundle fraction(BigFraction f) {
        String plain = CellText.exact(f);
        if (f.getDenominator().equals(BigInteger.ONE)) {
            return MimeBundle.text(plain);
        }
        String sign = f.getNumerator().signum() < 0 ? "-" : "";
        return MimeBundle.builder(plain).put(MimeBundle.TEXT_LATEX,
                "$" + sign + "\\frac{" + f.getNumerator().abs() + "}{" + f.getDenominator() + "}$").build();
    }

    private static String array(Object array) {
        int n = Array.getLength(array);
        StringBuilder sb = new StringBuilder(array.getClass().getComponentType().getSimpleName())
                .append('[').append(n).append("] {");
        for (int i = 0; i < Math.min(n, MAX_ELEMENTS); i++) {
            if (i > 0) {
                sb.append(", ");
            }
            Object v = Array.get(array, i);
            sb.append(v != null && v.getClass().isArray() ? array(v) : String.valueOf(v));
        }
        if (n > MAX_ELEMENTS) {
            sb.append(String.format(", \u2026 %,d more", n - MAX_ELEMENTS));
        }
        return sb.append('}').toString();
    }

    private static String collection(Collection<?> c) {
        String kind = c instanceof List ? "List" : c instanceof Set ? "Set" : "Collection";
        StringBuilder sb = new StringBuilder(kind).append(" of ").append(c.size()).append(": [");
        Iterator<?> it = c.iterator();
        for (int i = 0; i < MAX_ELEMENTS && it.hasNext(); i++) {
            if (i > 0) {
                sb.append(", ");
            }
            Object v = it.next();
            sb.append(v == c ? "(this collection)" : v != null && v.getClass().isArray() ? array(v) : String.valueOf(v));
        }
        if (c.size() > MAX_ELEMENTS) {
            sb.append(String.format(", \u2026 %,d more", c.size() - MAX_ELEMENTS));
        }
        return sb.append(']').toString();
    }

    private static String map(Map<?, ?> m) {
        StringBuilder sb = new StringBuilder("Map of ").append(m.size()).append(": {");
        Iterator<? extends Map.Entry<?, ?>> it = m.entrySet().iterator();
        for (int i = 0; i < MAX_ELEMENTS && it.hasNext(); i++) {
            if (i > 0) {
                sb.append(", ");
            }
            Map.Entry<?, ?> e = it.next();
            sb.append(e.getKey()).append('=').append(e.getValue());
        }
        if (m.size() > MAX_ELEMENTS) {
            sb.append(String.format(", \u2026 %,d more", m.size() - MAX_ELEMENTS));
        }
        return sb.append('}').toString();
    }
}
