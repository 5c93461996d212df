/**
 * Rich display of results in notebooks.
 *
 * <ul>
 *   <li>{@link org.microtally.notebook.render.Renderers}: a registry object turning any value into a
 *       {@link org.microtally.notebook.render.MimeBundle} (text/plain always; text/html, image/png,
 *       text/latex, text/markdown where they apply); {@code Renderers.render(Object)} uses the shared
 *       default registry.</li>
 *   <li>{@link org.microtally.notebook.render.TableDisplay}: aligned text and escaped HTML tables of
 *       any {@link org.microtally.Tabular}, exact numbers never rounded, one number format per
 *       floating-point column, long tables shortened around their peak
 *       ({@link org.microtally.notebook.render.CellText}, {@link org.microtally.notebook.render.TableFormat}).</li>
 *   <li>{@link org.microtally.notebook.render.Tables}: results to Tablesaw tables and back.</li>
 *   <li>{@link org.microtally.notebook.render.Charts}: XChart charts of results in our own look, shown as
 *       compact inline SVG written by our own writer (one path per series, round ticks, real text), PNG
 *       at 2x on request; charts of core types in {@link org.microtally.notebook.render.CountCharts},
 *       {@link org.microtally.notebook.render.SpectrumCharts} and
 *       {@link org.microtally.notebook.render.OccupationCharts}.</li>
 *   <li>{@link org.microtally.notebook.render.Html}, {@link org.microtally.notebook.render.Markdown},
 *       {@link org.microtally.notebook.render.Latex}: explicit wrappers for rich text;
 *       {@link org.microtally.notebook.render.Markup}: the one escaping and tag-stripping helper;
 *       {@link org.microtally.notebook.render.TexMath}: TeX math to MathML for script-free pages.</li>
 * </ul>
 * The core result types have their own displays (a compact table, a chart under it, a closed form
 * where one is known); every other {@link org.microtally.Tabular} gets the generic table.
 */
package org.microtally.notebook.render;
