package org.microtally.notebook.session;

import java.util.ArrayList;
import java.util.List;
import org.microtally.notebook.render.MimeBundle;

/** Records everything a cell sends to its output, with the time of arrival. */
final class Collector implements CellOutput {
    record Event(String kind, String text, MimeBundle bundle, String id, boolean update, long nanos) { }

    final List<Event> events = new ArrayList<>();

    @Override
    public synchronized void stream(boolean stderr, String text) {
        events.add(new Event(stderr ? "stderr" : "stdout", text, null, null, false, System.nanoTime()));
    }

    @Override
    public synchronized void display(MimeBundle bundle, String displayId, boolean update) {
        events.add(new Event("display", null, bundle, displayId, update, System.nanoTime()));
    }

    synchronized String text(boolean stderr) {
        StringBuilder sb = new StringBuilder();
        for (Event e : events) {
            if (e.kind.equals(stderr ? "stderr" : "stdout")) {
                sb.append(e.text);
            }
        }
        return sb.toString();
    }

    synchronized List<Event> displays() {
        return events.stream().filter(e -> e.kind.equals("display")).toList();
    }
}
