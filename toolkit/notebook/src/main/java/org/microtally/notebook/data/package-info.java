/**
 * Moving data in and out of notebooks: CSV export of any result or Tablesaw table ({@link
 * org.microtally.notebook.data.Csv}) and single-particle spectra read from CSV files or Tablesaw
 * tables ({@link org.microtally.notebook.data.SpectrumReader}); relative file names are taken in the
 * notebook's folder ({@link org.microtally.notebook.data.NotebookFolder}).
 */
package org.microtally.notebook.data;
