package dev.assay.kernel;

import java.util.ArrayList;
import java.util.Collection;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The symbols known at a point of a check: the problem's, then those that accepted {@code skolemize} and
 * {@code define} steps introduced. One name has one kind and one arity. Only the kernel extends it.
 */
public final class Signature {

    /** How a symbol entered the signature. */
    public enum Origin { PROBLEM, SKOLEM, DEFINITION }

    public record Entry(Symbol symbol, Origin origin, String step) {
    }

    private final LinkedHashMap<String, Entry> entries = new LinkedHashMap<>();

    Signature() {
    }

    Signature(Signature other) {
        entries.putAll(other.entries);
    }

    /** The symbol of this name, or null. */
    public Symbol lookup(String name) {
        Entry e = entries.get(name);
        return e == null ? null : e.symbol();
    }

    public Entry entry(String name) {
        return entries.get(name);
    }

    public boolean admits(Symbol s) {
        Entry e = entries.get(s.name());
        return e != null && e.symbol().equals(s);
    }

    public Collection<Entry> entries() {
        return Collections.unmodifiableCollection(entries.values());
    }

    /** The symbols steps introduced, in the order they were introduced. */
    public List<Entry> introduced() {
        List<Entry> out = new ArrayList<>();
        for (Entry e : entries.values()) if (e.origin() != Origin.PROBLEM) out.add(e);
        return out;
    }

    void add(Symbol s, Origin origin, String step) {
        Entry old = entries.putIfAbsent(s.name(), new Entry(s, origin, step));
        if (old != null && !old.symbol().equals(s)) {
            throw new IllegalArgumentException(s.name() + " is already " + old.symbol());
        }
    }

    Map<String, Entry> view() {
        return Collections.unmodifiableMap(entries);
    }
}
