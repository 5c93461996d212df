package org.microtally.structure;

import java.util.ArrayList;
import java.util.List;
import org.microtally.Tabular;

/**
 * White-dwarf models along a sequence of central densities, one row each (mass in IAU 2015 solar
 * masses, radius in km, central density in g/cm^3 as the field quotes it). Immutable. The model
 * limits of {@link WhiteDwarf} apply to every row: ideal cold electron gas, Newtonian, no Coulomb
 * corrections, no neutronisation; not for engineering or safety use.
 */
public final class MassRadiusCurve implements Tabular {
    static final List<String> COLUMNS = List.of("mu_e", "rho_c (g/cm^3)", "x_c", "M (M_sun)", "R (km)", "M/M_Ch");

    private final List<WhiteDwarf> models;

    MassRadiusCurve(List<WhiteDwarf> models) {
        this.models = List.copyOf(models);
    }

    /** The models, in order of increasing central density. */
    public List<WhiteDwarf> models() {
        return models;
    }

    @Override
    public List<String> columnNames() {
        return COLUMNS;
    }

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> rows = new ArrayList<>(models.size());
        for (WhiteDwarf m : models) {
            rows.add(m.row());
        }
        return List.copyOf(rows);
    }
}
