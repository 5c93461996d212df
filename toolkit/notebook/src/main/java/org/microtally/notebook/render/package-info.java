/**
 * Rich display of results in notebooks.
 *
 * <ul>
 *   <li>{@link org.microtally.notebook.render.Renderers#render(Object)}: any value to a
 *       {@link org.microtally.notebook.render.MimeBundle} (text/plain always; text/html, image/png,
 *       image/svg+xml, text/latex, text/markdown where they apply), dispatched by a registry keyed by
 *       class ({@link org.microtally.notebook.render.Renderers#register}).</li>
 *   <li>{@link org.microtally.notebook.render.TableDisplay}: aligned text and escaped HTML tables of
 *       any {@link org.microtally.Tabular}, exact numbers never rounded
 *       ({@link org.microtally.notebook.render.CellText}, {@link org.microtally.notebook.render.TableFormat}).</li>
 *   <li>{@link org.microtally.notebook.render.Tables}: results to Tablesaw tables and back.</li>
 *   <li>{@link org.microtally.notebook.render.Charts}: XChart charts of results in our own look, PNG and
 *       SVG drawn in memory on a headless JVM ({@link org.microtally.notebook.render.DisplayEnvironment}).</li>
 *   <li>{@link org.microtally.notebook.render.Html}, {@link org.microtally.notebook.render.Markdown},
 *       {@link org.microtally.notebook.render.Latex}: explicit wrappers for rich text.</li>
 * </ul>
 * The core result types have their own displays (a compact table, a chart under it, a closed form
 * where one is known); every other {@link org.microtally.Tabular} gets the generic table.
 */
package org.microtally.notebook.render;
