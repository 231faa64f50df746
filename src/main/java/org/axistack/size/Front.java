package org.axistack.size;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * The trade-off front: the feasible designs that no other feasible design beats on all three of spherical
 * aberration, bias magnitude and surface field (Pareto non-dominance, V. Pareto 1896; the usual definition in
 * multi-objective optimisation), sorted by Cs.
 */
public final class Front {
    private Front() {
    }

    public static List<Design> of(List<Design> designs) {
        List<Design> feasible = designs.stream().filter(Design::feasible).toList();
        List<Design> front = new ArrayList<>();
        for (Design a : feasible) {
            boolean dominated = false;
            for (Design b : feasible) {
                if (b != a && dominates(b, a)) {
                    dominated = true;
                    break;
                }
            }
            if (!dominated) {
                front.add(a);
            }
        }
        front.sort(Comparator.comparingDouble(Design::spherical_m));
        return front;
    }

    static boolean dominates(Design b, Design a) {
        double[] x = key(b), y = key(a);
        boolean strictly = false;
        for (int i = 0; i < x.length; i++) {
            if (x[i] > y[i]) {
                return false;
            }
            if (x[i] < y[i]) {
                strictly = true;
            }
        }
        return strictly;
    }

    private static double[] key(Design d) {
        return new double[] {d.spherical_m(), d.maxAbsBias_V(), d.maxSurfaceField_V_per_m()};
    }
}
