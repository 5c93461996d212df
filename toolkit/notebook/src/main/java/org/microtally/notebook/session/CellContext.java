package org.microtally.notebook.session;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import org.microtally.notebook.render.MimeBundle;

/**
 * The state of one running cell: where its output goes. All calls into the {@link CellOutput}
 * are made while holding this object's lock, so the sink sees one call at a time and in order
 * (pending stream text is always delivered before a display that follows it).
 */
final class CellContext {
    /** Pending text is delivered at least this often while a cell runs. */
    static final long FLUSH_INTERVAL_MS = 50;
    private static final int MAX_PENDING = 8192;

    final ThreadGroup group;
    private final CellOutput sink;
    private final Pending out = new Pending(false);
    private final Pending err = new Pending(true);

    CellContext(ThreadGroup group, CellOutput sink) {
        this.group = group;
        this.sink = sink;
    }

    synchronized void write(boolean stderr, byte[] b, int off, int len) {
        Pending p = stderr ? err : out;
        p.buffer.write(b, off, len);
        long now = System.nanoTime();
        if (p.buffer.size() >= MAX_PENDING || now - p.lastEmit >= FLUSH_INTERVAL_MS * 1_000_000L) {
            p.emit(false);
        }
    }

    /** Delivers pending text; at the end of the cell also an incomplete trailing character. */
    synchronized void flush(boolean end) {
        out.emit(end);
        err.emit(end);
    }

    synchronized void display(MimeBundle bundle, String id, boolean update) {
        flush(false);
        try {
            sink.display(bundle, id, update);
        } catch (RuntimeException e) {
            sinkFailed(e);
        }
    }

    /** A failing output sink must not turn into an exception in the cell's own print call. */
    private void sinkFailed(RuntimeException e) {
        OutputRouter.CONSOLE_ERR.println("microtally engine: the cell output sink failed and dropped output: " + e);
    }

    private final class Pending {
        final boolean stderr;
        final ByteArrayOutputStream buffer = new ByteArrayOutputStream();
        long lastEmit = System.nanoTime();

        Pending(boolean stderr) {
            this.stderr = stderr;
        }

        void emit(boolean end) {
            lastEmit = System.nanoTime();
            if (buffer.size() == 0) {
                return;
            }
            byte[] bytes = buffer.toByteArray();
            int cut = end ? bytes.length : completeUtf8Prefix(bytes);
            if (cut == 0) {
                return;
            }
            buffer.reset();
            buffer.write(bytes, cut, bytes.length - cut);
            try {
                sink.stream(stderr, new String(bytes, 0, cut, StandardCharsets.UTF_8));
            } catch (RuntimeException e) {
                sinkFailed(e);
            }
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
