package org.precedent.api.system;

import org.precedent.engine.decide.Pipeline;

/** What the service decides with right now: an opened model and the pipeline over it. */
record Served(SharedInForce loaded, Pipeline pipeline) {}
