/**
 * The Jupyter front door of the toolkit: {@code microtally kernel}, {@code install-kernel},
 * {@code run}, the shaded jar's {@link org.microtally.kernel.Main}.
 *
 * <h2>Library</h2>
 * Built on io.github.spencerpark:jupyter-jvm-basekernel 2.3.0 (Maven Central), used as a plain
 * library: its connection-file parser, its message model (headers, request/reply/publish contents,
 * display data, language info) and its public JSON adapters, combined by {@code WireCodec} the way
 * the library combines them (no reflection into it). Sockets are JeroMQ 0.5.1 and JSON is Gson,
 * both declared in the pom. Chosen over the org.dflib.jjava:jjava-jupyter 1.0-a6 fork because the fork
 * is an alpha and we replace exactly the parts of the library that have known problems, which are
 * the same in both: its socket loop ({@code Loop} sleeps 50 ms between polls), its signature check
 * ({@code String.equals}, not constant time), its logging (java.util.logging to stderr), and its
 * execute_reply content (the status of a successful reply serializes as "error").
 *
 * <h2>What this package adds</h2>
 * <ul>
 *   <li>{@code WireCodec}: frames, HMAC-SHA256 signing and constant-time verification, header and
 *       content shape checks; a message with a bad signature or of the wrong shape is dropped and
 *       logged, never handled.</li>
 *   <li>{@code Kernel} (lifecycle and socket loops that never end on an exception),
 *       {@code KernelWire} (sockets, receive, reply, IOPub under a lock), {@code Requests} (the
 *       answers), {@code CellExecution} (execute, IOPub output as the engine delivers it, aborts,
 *       repeated interrupts), {@code EngineSlot} (the engine, opened in the background after the
 *       first kernel_info reply), {@code HeapCheck} (after OUT_OF_MEMORY), and a report when the
 *       JVM is made to exit while a cell runs. An empty connection key is warned about (log,
 *       banner) or refused with {@code --refuse-unsigned}.</li>
 *   <li>{@code KernelSpec}, {@code ClassArchive}: the kernelspec (argv with -Xmx1g -XX:+UseSerialGC,
 *       interrupt_mode message) and the class data archive that speeds the kernel's start.</li>
 *   <li>{@code KernelLog}, {@code ParentWatch}: diagnostics to a file beside the connection file,
 *       exit when the parent process dies.</li>
 * </ul>
 */
package org.microtally.kernel;
