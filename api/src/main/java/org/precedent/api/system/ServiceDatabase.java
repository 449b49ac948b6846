package org.precedent.api.system;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.springframework.core.env.MapPropertySource;
import org.springframework.core.env.MutablePropertySources;
import org.springframework.core.env.SimpleCommandLinePropertySource;
import org.springframework.core.env.StandardEnvironment;
import org.springframework.core.io.ClassPathResource;
import org.springframework.core.io.support.ResourcePropertySource;

/**
 * The service's database as {@code precedent serve} would find it, for the commands that write
 * it without the service (the command line's threshold change): {@code spring.datasource.url},
 * {@code .username} and {@code .password} read from the same places, in the same order, as the
 * service reads them: {@code --name=value} settings, Java system properties, the environment
 * ({@code SPRING_DATASOURCE_URL}, ...), then the service's own {@code application.properties},
 * whose address is the data directory's H2 file. Spring Boot's further places (configuration
 * files in the working directory, {@code SPRING_APPLICATION_JSON}) are not read.
 */
public record ServiceDatabase(String url, String user, String password) {
  private static final String PREFIX = "spring.datasource.";

  /** The database the service on {@code data}, given {@code settings}, would use. */
  public static ServiceDatabase of(Path data, List<String> settings) {
    StandardEnvironment env = new StandardEnvironment();
    MutablePropertySources sources = env.getPropertySources();
    sources.addFirst(new SimpleCommandLinePropertySource(settings.toArray(String[]::new)));
    // Set by the service's start on its command line, so above everything else.
    sources.addFirst(new MapPropertySource("precedent.data", Map.of("precedent.data",
        data.toAbsolutePath().normalize().toString())));
    try {
      sources.addLast(new ResourcePropertySource(new ClassPathResource("application.properties",
          ServiceDatabase.class.getClassLoader())));
    } catch (IOException e) {
      throw new UncheckedIOException("the service's application.properties cannot be read", e);
    }
    return new ServiceDatabase(env.getRequiredProperty(PREFIX + "url"),
        env.getProperty(PREFIX + "username", ""), env.getProperty(PREFIX + "password", ""));
  }

  /** Whether this is an H2 database (a file one process holds at a time), not a server. */
  public boolean isH2() {
    return url.startsWith("jdbc:h2:");
  }

  /** The address without its parameters (which may hold a password), for messages. */
  public String shown() {
    return url.split("[?;]", 2)[0];
  }

  @Override
  public String toString() {
    // Never the password.
    return "ServiceDatabase[" + shown() + ", user " + user + "]";
  }
}
