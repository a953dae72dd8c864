package dev.assay.fuzz;

import net.jqwik.api.lifecycle.AroundPropertyHook;
import net.jqwik.api.lifecycle.PropagationMode;
import net.jqwik.api.lifecycle.PropertyExecutionResult;
import net.jqwik.api.lifecycle.PropertyExecutor;
import net.jqwik.api.lifecycle.PropertyLifecycleContext;

/**
 * How much to fuzz. The default run keeps the tries written on each property; {@code -Dassay.fuzz=long} multiplies
 * them by {@code assay.fuzz.factor} (default 40) and lets the DEEP_* mutations nest past the default depth limit.
 * Maven passes {@code -D} user properties on to the forked test JVM as system properties, so
 * {@code mvn test -Dassay.fuzz=long} reaches this class.
 */
public final class FuzzScale implements AroundPropertyHook {

    public static boolean isLong() {
        return "long".equals(System.getProperty("assay.fuzz"));
    }

    public static int factor() {
        return isLong() ? Integer.getInteger("assay.fuzz.factor", 40) : 1;
    }

    /** Largest nesting a mutation makes: well under the 100,000 default limit by default, past it in the long run. */
    public static int maxNesting() {
        return isLong() ? 120_000 : 3_000;
    }

    /** Registered on a test class, the hook applies to every property in it. */
    @Override
    public PropagationMode propagateTo() {
        return PropagationMode.ALL_DESCENDANTS;
    }

    @Override
    public PropertyExecutionResult aroundProperty(PropertyLifecycleContext context, PropertyExecutor property) {
        int f = factor();
        // An @Example has one try and stays one.
        if (f != 1) context.attributes().tries().filter(t -> t > 1).ifPresent(t -> context.attributes().setTries(t * f));
        return property.execute();
    }
}
