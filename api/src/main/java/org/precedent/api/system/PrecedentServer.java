package org.precedent.api.system;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.store.DataDir;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.boot.SpringApplication;
import org.springframework.boot.autoconfigure.SpringBootApplication;
import org.springframework.boot.web.servlet.context.ServletWebServerApplicationContext;
import org.springframework.context.ConfigurableApplicationContext;
import org.springframework.context.annotation.Bean;

/**
 * The HTTP service: the Spring application behind {@code precedent serve}. Only that command starts
 * it, so the other commands stay free of Spring's start-up time.
 */
@SpringBootApplication(scanBasePackages = "org.precedent.api")
public class PrecedentServer {

  /**
   * Starts the service on the active model of {@code data} and returns once it takes requests.
   *
   * @param port  the port, 0 for any free one
   * @param extra further settings as {@code --name=value} arguments
   * @throws ServiceStartException saying which file or part is at fault and what is wrong
   */
  public static ConfigurableApplicationContext start(Path data, int port, List<String> extra)
      throws IOException {
    Path root = data.toAbsolutePath().normalize();
    new DataDir(root).makePrivate();
    Path service = root.resolve("service");
    AtomicFiles.createPrivateDirectories(service);
    List<String> args = new ArrayList<>();
    args.add("--precedent.data=" + root);
    args.add("--server.port=" + port);
    args.addAll(extra);
    SpringApplication app = new SpringApplication(PrecedentServer.class);
    app.addListeners(new DatabaseFileCheck());
    ConfigurableApplicationContext context;
    try {
      context = app.run(args.toArray(String[]::new));
    } catch (RuntimeException e) {
      throw ServiceStartException.of(e);
    }
    // The database's files come from H2, with the process's default permissions.
    AtomicFiles.makePrivate(service);
    return context;
  }

  /** The port the running service listens on. */
  public static int port(ConfigurableApplicationContext context) {
    return ((ServletWebServerApplicationContext) context).getWebServer().getPort();
  }

  /**
   * Where to reach the running service from this machine: https when TLS is set up, and the
   * configured address unless it is this machine's own or every interface.
   */
  public static String url(ConfigurableApplicationContext context) {
    var server = (org.springframework.boot.web.embedded.tomcat.TomcatWebServer)
        ((ServletWebServerApplicationContext) context).getWebServer();
    String scheme = server.getTomcat().getConnector().getScheme();
    String host = "localhost";
    String address = context.getEnvironment().getProperty("server.address", "");
    try {
      java.net.InetAddress bound = java.net.InetAddress.getByName(address);
      if (!address.isBlank() && !bound.isLoopbackAddress() && !bound.isAnyLocalAddress()) {
        host = bound instanceof java.net.Inet6Address ? "[" + address + "]" : address;
      }
    } catch (java.net.UnknownHostException e) {
      host = address;
    }
    return scheme + "://" + host + ":" + port(context) + "/";
  }

  @Bean(destroyMethod = "close")
  InForceHolder modelHolder(@Value("${precedent.data}") Path data) throws IOException {
    return new InForceHolder(new DataDir(data));
  }
}
