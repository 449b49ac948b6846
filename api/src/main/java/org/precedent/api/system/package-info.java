/**
 * The service's frame: starting it ({@link org.precedent.api.system.PrecedentServer}, with {@link
 * org.precedent.api.system.ServiceStartException} naming the file at fault), who may call it ({@link
 * org.precedent.api.system.SecurityConfig}, {@link org.precedent.api.system.SignInFilter}, {@link
 * org.precedent.api.system.Credentials}, {@link org.precedent.api.system.SignInLimiter}), the model in
 * force and its atomic swap ({@link org.precedent.api.system.ModelHolder} and its leases), the decision
 * slots that bound concurrent work, the thresholds and model version shared by replicas on one
 * database ({@link org.precedent.api.system.ReplicaSync}), the database the service is set to use as the command line finds it ({@link org.precedent.api.system.ServiceDatabase}), request limits and strict JSON, every error as an RFC 9457 problem
 * ({@link org.precedent.api.system.ErrorAdvice}), and storage failures and health. It depends on
 * {@code engine.decide}, {@code engine.rerank} and {@code rerank.store}, {@code knowledge.store},
 * {@code knowledge.io}, and on Spring Boot, Spring Security, HikariCP, Micrometer, springdoc and
 * Jackson; the service's feature packages ({@code suggest}, {@code queue}, {@code threshold}, {@code
 * models}) depend on it, and it depends on none of them.
 */
package org.precedent.api.system;
