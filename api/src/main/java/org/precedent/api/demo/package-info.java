/**
 * The generator of the demo help desk, Tarnwick Vale Water &amp; Waste, an invented utility: {@link
 * org.precedent.api.demo.DemoTicketGenerator} writes the resolved tickets under {@code demo-data/}
 * (replies reusing a catalogue of {@link org.precedent.api.demo.DemoAnswers}, safety cases a person
 * must answer, one-off cases) with customers' text wrapped as real mail is ({@link
 * org.precedent.api.demo.DemoCustomerText}) and invented personal data in ranges reserved for fiction
 * ({@link org.precedent.api.demo.DemoPeople}), all reproducible from a seed. It depends on the JDK and
 * commons-csv only, and on no other package of Precedent; the command line's benchmarks use it for
 * realistic question text.
 */
package org.precedent.api.demo;
