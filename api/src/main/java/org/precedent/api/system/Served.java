package org.precedent.api.system;

import org.precedent.engine.decide.Advisor;

/** What the service decides with right now: an opened model and the advisor over it. */
record Served(LoadedModel loaded, Advisor advisor) {}
