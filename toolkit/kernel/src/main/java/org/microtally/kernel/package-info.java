/**
 * The Jupyter front door of the toolkit: {@code microtally kernel}, {@code install-kernel},
 * {@code run}, the shaded jar's {@link org.microtally.kernel.Main}.
 *
 * <h2>Library</h2>
 * Built on io.github.spencerpark:jupyter-jvm-basekernel 2.3.0 (Maven Central): its connection-file
 * parser, its message model (headers, request/reply/publish contents, display data, language info)
 * and its JSON mapping. Chosen over the org.dflib.jjava:jjava-jupyter 1.0-a6 fork because the fork
 * is an alpha and we replace exactly the parts of the library that have known problems, which are
 * the same in both: its socket loop ({@code Loop} sleeps 50 ms between polls), its signature check
 * ({@code String.equals}, not constant time), its logging (java.util.logging to stderr), and its
 * execute_reply content (the status of a successful reply serializes as "error").
 *
 * <h2>What this package adds</h2>
 * <ul>
 *   <li>{@code WireCodec}: frames, HMAC-SHA256 signing and constant-time verification; a message
 *       with a bad signature is dropped and logged, never handled.</li>
 *   <li>{@code Kernel}: one thread per channel waiting in a ZeroMQ poll (no sleep), IOPub shared
 *       under a lock, the engine opened in the background after the first kernel_info reply,
 *       batched stream output, interrupts repeated until the cell stops, heap recovery after an
 *       OutOfMemoryError, and a report when the JVM is made to exit while a cell runs.</li>
 *   <li>{@code KernelSpec}, {@code ClassArchive}: the kernelspec (argv with -Xmx1g -XX:+UseSerialGC,
 *       interrupt_mode message) and the class data archive that speeds the kernel's start.</li>
 *   <li>{@code KernelLog}, {@code ParentWatch}: diagnostics to a file beside the connection file,
 *       exit when the parent process dies.</li>
 * </ul>
 */
package org.microtally.kernel;
