package org.microtally.ensemble;

import java.util.List;
import org.microtally.spectrum.Spectrum;

/** The cutoff warning shared by the thermal ensembles. */
final class TruncationCheck {
    private TruncationCheck() { }

    /** Top-level occupation (particles in the whole top level) above which a truncated spectrum is flagged. */
    static final double THRESHOLD = 1e-8;

    /**
     * A warning when {@code spectrum} is truncated and its top level still holds more than
     * {@link #THRESHOLD} (times max(1, N)) particles: the omitted levels above would hold a comparable
     * amount, so the result depends on the cutoff. The estimate given is that occupation.
     */
    static List<String> warnings(Spectrum spectrum, double topLevelOccupation, double n) {
        if (spectrum.isTruncated() && topLevelOccupation > THRESHOLD * Math.max(1.0, n)) {
            return List.of(String.format(
                    "spectrum truncated at %s %s and its top level still holds %.3g particles (%.3g of N): the "
                            + "result depends on the cutoff at about this level; raise the cutoff or lower kT (%s)",
                    spectrum.topEnergy(), spectrum.scale().name(), topLevelOccupation, topLevelOccupation / n,
                    spectrum.cutoffNote()));
        }
        return List.of();
    }
}
