package dev.assay.kernel;

import java.util.ArrayList;
import java.util.List;

/** Term positions: dot-separated argument indices from an atom, counting from 1 ({@code 1.2} in {@code P(f(a, b))} is b). */
final class Positions {

    private Positions() {
    }

    /** The subterm at {@code path} below {@code atom}, or null when the path leaves the term; never the atom itself. */
    static Term subterm(Application atom, int[] path) {
        if (path.length == 0) return null;
        Term t = atom;
        for (int index : path) {
            if (!(t instanceof Application a) || index < 1 || index > a.arity()) return null;
            t = a.argument(index - 1);
        }
        return t;
    }

    /** {@code atom} with the subterm at {@code path} replaced by {@code replacement}; the path must exist. */
    static Term replace(TermFactory terms, Application atom, int[] path, Term replacement) {
        List<Application> spine = new ArrayList<>(path.length);
        Term t = atom;
        for (int index : path) {
            Application a = (Application) t;
            spine.add(a);
            t = a.argument(index - 1);
        }
        Term result = replacement;
        for (int k = path.length - 1; k >= 0; k--) {
            Application a = spine.get(k);
            Term[] args = a.argumentArray().clone();
            args[path[k] - 1] = result;
            result = terms.application(a.symbol(), args);
        }
        return result;
    }

    static String render(int[] path) {
        StringBuilder sb = new StringBuilder();
        for (int k = 0; k < path.length; k++) {
            if (k > 0) sb.append('.');
            sb.append(path[k]);
        }
        return sb.toString();
    }
}
