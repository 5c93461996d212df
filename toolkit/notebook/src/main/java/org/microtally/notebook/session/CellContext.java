package org.microtally.notebook.session;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import org.microtally.notebook.render.MimeBundle;

/**
 * The state of one running cell: where its output goes, as one ordered queue. Standard output,
 * standard error and displays are delivered to the {@link CellOutput} in exactly the order the
 * cell wrote them: text of one stream is gathered until the other stream is written, a display is
 * shown, {@value #MAX_PENDING} bytes have gathered or {@value #FLUSH_INTERVAL_MS} ms have passed;
 * then the gathered text goes out first. All calls into the sink are made while holding this
 * object's lock, so the sink sees one call at a time. This is the only place output is batched.
 */
final class CellContext {
    /** Pending text is delivered at least this often while a cell runs. */
    static final long FLUSH_INTERVAL_MS = 50;
    static final int MAX_PENDING = 8192;

    final ThreadGroup group;
    private final CellOutput sink;
    private final ByteArrayOutputStream pending = new ByteArrayOutputStream();
    private boolean pendingIsStderr;
    private long lastEmit = System.nanoTime();

    CellContext(ThreadGroup group, CellOutput sink) {
        this.group = group;
        this.sink = sink;
    }

    synchronized void write(boolean stderr, byte[] b, int off, int len) {
        if (pending.size() > 0 && stderr != pendingIsStderr) {
            emit(true);   // the other stream's text came first: it goes out first, whole
        }
        pendingIsStderr = stderr;
        pending.write(b, off, len);
        if (pending.size() >= MAX_PENDING || System.nanoTime() - lastEmit >= FLUSH_INTERVAL_MS * 1_000_000L) {
            emit(false);
        }
    }

    /** Delivers pending text; at the end of the cell also an incomplete trailing character. */
    synchronized void flush(boolean end) {
        emit(end);
    }

    synchronized void display(MimeBundle bundle, String id, boolean update, boolean progress) {
        emit(false);
        try {
            if (progress) {
                sink.progress(bundle, id, update);
            } else {
                sink.display(bundle, id, update);
            }
        } catch (RuntimeException e) {
            sinkFailed(e);
        }
    }

    /** A failing output sink must not turn into an exception in the cell's own print call. */
    private void sinkFailed(RuntimeException e) {
        OutputRouter.CONSOLE_ERR.println("microtally: the cell output sink failed and dropped output: " + e);
    }

    private void emit(boolean whole) {
        lastEmit = System.nanoTime();
        if (pending.size() == 0) {
            return;
        }
        byte[] bytes = pending.toByteArray();
        int cut = whole ? bytes.length : completeUtf8Prefix(bytes);
        if (cut == 0) {
            return;
        }
        pending.reset();
        pending.write(bytes, cut, bytes.length - cut);
        try {
            sink.stream(pendingIsStderr, new String(bytes, 0, cut, StandardCharsets.UTF_8));
        } catch (RuntimeException e) {
            sinkFailed(e);
        }
    }

    /** Length of the longest prefix that does not end inside a UTF-8 multi-byte sequence. */
    static int completeUtf8Prefix(byte[] b) {
        int n = b.length;
        int i = n - 1;
        int back = 0;
        while (i >= 0 && back < 4 && (b[i] & 0xC0) == 0x80) {
            i--;
            back++;
        }
        if (i < 0) {
            return n;
        }
        int lead = b[i] & 0xFF;
        int need = lead >= 0xF0 ? 4 : lead >= 0xE0 ? 3 : lead >= 0xC0 ? 2 : 1;
        return (n - i) < need ? i : n;
    }
}
