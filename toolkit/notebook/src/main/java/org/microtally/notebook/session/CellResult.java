package org.microtally.notebook.session;

import java.util.Optional;
import org.microtally.notebook.render.MimeBundle;

/**
 * The outcome of running one cell.
 *
 * @param outcome whether it succeeded, failed to compile, threw, or was interrupted
 * @param value   the rendered value of the cell's last expression, if it had one and succeeded
 * @param raw     that value itself (the real object), if any
 * @param error   why it failed, when {@code outcome != OK}
 * @param phases  where the engine's time for the cell went ({@link CellPhases#NONE} when not measured)
 */
public record CellResult(Outcome outcome, Optional<MimeBundle> value, Optional<Object> raw, Optional<CellError> error,
                         CellPhases phases) {

    /** A result without phase timings. */
    public CellResult(Outcome outcome, Optional<MimeBundle> value, Optional<Object> raw, Optional<CellError> error) {
        this(outcome, value, raw, error, CellPhases.NONE);
    }

    /** This result with the given phase timings. */
    public CellResult withPhases(CellPhases measured) {
        return new CellResult(outcome, value, raw, error, measured);
    }

    /**
     * How a cell ended. {@code OUT_OF_MEMORY} is a runtime error that exhausted the heap: a front
     * end may check whether the heap recovered (the kernel does) before running more cells.
     */
    public enum Outcome { OK, COMPILE_ERROR, RUNTIME_ERROR, OUT_OF_MEMORY, INTERRUPTED }

    /** True when the cell ran to the end without error. */
    public boolean ok() {
        return outcome == Outcome.OK;
    }
}
