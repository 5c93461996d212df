package org.microtally.structure;

import org.microtally.Tabular;
import org.microtally.units.Iau2015;

/**
 * What every hydrostatic model of this package gives: its central density and relativity parameter,
 * its mass and radius. Immutable; the model limits are stated by each subclass.
 */
public abstract class CompactStar implements Tabular {
    private final double centralDensity;
    private final double centralX;
    private final double mass;
    private final double radius;

    CompactStar(double centralDensity, double centralX, double mass, double radius) {
        this.centralDensity = centralDensity;
        this.centralX = centralX;
        this.mass = mass;
        this.radius = radius;
    }

    /** Central (rest-)mass density in kg/m^3. */
    public double centralDensity() {
        return centralDensity;
    }

    /** Central relativity parameter x_c = p_F/(m c) of the degenerate fermions. */
    public double centralRelativityParameter() {
        return centralX;
    }

    /** Mass (gravitational mass for general-relativistic models) in kg. */
    public double mass() {
        return mass;
    }

    /** Mass in IAU 2015 nominal solar masses. */
    public double solarMasses() {
        return mass / Iau2015.SOLAR_MASS;
    }

    /** Radius (circumferential for general-relativistic models) in m. */
    public double radius() {
        return radius;
    }

    /** Radius in km. */
    public double radiusKm() {
        return radius / 1e3;
    }
}
