package org.precedent.api.system;

import jakarta.servlet.AsyncContext;
import jakarta.servlet.AsyncEvent;
import jakarta.servlet.AsyncListener;
import jakarta.servlet.DispatcherType;
import jakarta.servlet.FilterChain;
import jakarta.servlet.ReadListener;
import jakarta.servlet.ServletException;
import jakarta.servlet.ServletInputStream;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import jakarta.servlet.http.HttpServletResponse;
import java.io.BufferedReader;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.util.concurrent.atomic.AtomicBoolean;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Receives a request's whole body before the request goes on, without holding a thread while the
 * bytes arrive, and within a time limit.
 *
 * <p>The connector reads a body on the request's worker thread, blocking until the bytes come. A
 * client that sends its headers and part of a body and then stalls would keep that thread for the
 * whole read timeout, and a few hundred such clients would take every thread, health checks
 * included. Here the body is read with non-blocking reads as it arrives; the request goes on (in a
 * dispatch of its own, on a worker thread) only once all of it is in. A body that has not arrived
 * within {@code precedent.limits.body-seconds} is answered 408 and its connection closed; one that
 * passes the size limit ({@link RequestSizeFilter}, which runs first) is answered 413.
 */
@Component
@Order(Ordered.HIGHEST_PRECEDENCE + 10)
class WholeBodyFilter extends OncePerRequestFilter {
  private static final String BODY = WholeBodyFilter.class.getName() + ".body";
  private final long timeoutMs;

  WholeBodyFilter(@Value("${precedent.limits.body-seconds}") long seconds) {
    this.timeoutMs = seconds * 1000;
  }

  // The second pass, with the body in hand, is an async dispatch: this filter must see it.
  @Override
  protected boolean shouldNotFilterAsyncDispatch() {
    return false;
  }

  @Override
  protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response,
      FilterChain chain) throws ServletException, IOException {
    if (request.getDispatcherType() == DispatcherType.ASYNC) {
      Object body = request.getAttribute(BODY);
      if (body instanceof byte[] bytes) {
        request.removeAttribute(BODY);
        chain.doFilter(new Received(request, bytes), response);
      } else {
        chain.doFilter(request, response);
      }
      return;
    }
    boolean chunked = "chunked".equalsIgnoreCase(request.getHeader("Transfer-Encoding"));
    if (request.getContentLengthLong() <= 0 && !chunked) {
      chain.doFilter(request, response);
      return;
    }
    receive(request, response);
  }

  private void receive(HttpServletRequest request, HttpServletResponse response)
      throws IOException {
    AsyncContext async = request.startAsync(request, response);
    async.setTimeout(timeoutMs);
    AtomicBoolean ended = new AtomicBoolean();
    async.addListener(new AsyncListener() {
      @Override
      public void onTimeout(AsyncEvent event) {
        refuse(async, ended, 408, "Request Timeout", "the request body did not arrive within "
            + timeoutMs / 1000 + " s");
      }

      @Override
      public void onError(AsyncEvent event) {
        refuse(async, ended, 400, "Bad Request", "the request body could not be read");
      }

      @Override
      public void onComplete(AsyncEvent event) {}

      @Override
      public void onStartAsync(AsyncEvent event) {}
    });
    ServletInputStream in = request.getInputStream();
    long declared = request.getContentLengthLong();
    ByteArrayOutputStream body = new ByteArrayOutputStream(
        declared > 0 ? (int) Math.min(declared, 64 * 1024) : 1024);
    in.setReadListener(new ReadListener() {
      private final byte[] buffer = new byte[8192];

      @Override
      public void onDataAvailable() throws IOException {
        try {
          while (in.isReady()) {
            int n = in.read(buffer);
            if (n < 0) {
              return;
            }
            body.write(buffer, 0, n);
          }
        } catch (RequestSizeFilter.TooLarge e) {
          refuse(async, ended, 413, "Content Too Large", e.getMessage());
        }
      }

      @Override
      public void onAllDataRead() {
        if (ended.compareAndSet(false, true)) {
          request.setAttribute(BODY, body.toByteArray());
          async.dispatch();
        }
      }

      @Override
      public void onError(Throwable t) {
        if (t instanceof java.net.SocketTimeoutException) {
          refuse(async, ended, 408, "Request Timeout", "the request body stopped arriving");
        } else {
          refuse(async, ended, 400, "Bad Request", "the request body could not be read");
        }
      }
    });
  }

  /** Answers at once and closes the connection: what is left of the body is not worth reading. */
  private static void refuse(AsyncContext async, AtomicBoolean ended, int status, String title,
      String detail) {
    if (!ended.compareAndSet(false, true)) {
      return;
    }
    try {
      HttpServletResponse response = (HttpServletResponse) async.getResponse();
      if (!response.isCommitted()) {
        response.setStatus(status);
        response.setHeader("Connection", "close");
        response.setContentType("application/problem+json");
        response.getOutputStream().write(("{\"type\":\"about:blank\",\"title\":\"" + title
            + "\",\"status\":" + status + ",\"detail\":\"" + detail + "\"}")
            .getBytes(StandardCharsets.UTF_8));
      }
    } catch (IOException | IllegalStateException e) {
      // The client is gone: nothing to tell it.
    } finally {
      async.complete();
    }
  }

  /** The request as it arrived, its body read from memory. */
  private static final class Received extends HttpServletRequestWrapper {
    private final byte[] body;

    Received(HttpServletRequest request, byte[] body) {
      super(request);
      this.body = body;
    }

    // The filters and handlers after this one see the request they would have seen had the body
    // been read in line: a first pass, not a return from waiting.
    @Override
    public DispatcherType getDispatcherType() {
      return DispatcherType.REQUEST;
    }

    @Override
    public ServletInputStream getInputStream() {
      ByteArrayInputStream in = new ByteArrayInputStream(body);
      return new ServletInputStream() {
        @Override
        public int read() {
          return in.read();
        }

        @Override
        public int read(byte[] b, int off, int len) {
          return in.read(b, off, len);
        }

        @Override
        public boolean isFinished() {
          return in.available() == 0;
        }

        @Override
        public boolean isReady() {
          return true;
        }

        @Override
        public void setReadListener(ReadListener listener) {
          try {
            listener.onAllDataRead();
          } catch (IOException e) {
            listener.onError(e);
          }
        }
      };
    }

    @Override
    public BufferedReader getReader() {
      String encoding = getCharacterEncoding();
      Charset charset = encoding == null ? StandardCharsets.UTF_8 : Charset.forName(encoding);
      return new BufferedReader(new InputStreamReader(new ByteArrayInputStream(body), charset));
    }
  }
}
