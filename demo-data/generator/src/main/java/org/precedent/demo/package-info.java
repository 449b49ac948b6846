/**
 * The generator of the demo help desk, Tarnwick Vale Water &amp; Waste, an invented utility: {@link
 * org.precedent.demo.DemoTicketGenerator} writes the resolved tickets under {@code demo-data/}
 * (replies reusing a catalogue of {@link org.precedent.demo.DemoAnswers}, safety cases a person
 * must answer, one-off cases) with customers' text wrapped as real mail is ({@link
 * org.precedent.demo.DemoCustomerText}) and invented personal data in ranges reserved for fiction
 * ({@link org.precedent.demo.DemoPeople}), all reproducible from a seed. It depends on the JDK and
 * commons-csv only, and on no other package of Precedent; it is a module of its own, beside the files
 * it writes, and the command line's benchmarks use it for realistic question text.
 */
package org.precedent.demo;
