package org.precedent.api.system;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ReadListener;
import jakarta.servlet.ServletException;
import jakarta.servlet.ServletInputStream;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Refuses request bodies over the configured size before they are read into memory: at once when
 * the length is declared, and as soon as the limit is passed when it is not (chunked bodies).
 */
@Component
@Order(Ordered.HIGHEST_PRECEDENCE)
class RequestSizeFilter extends OncePerRequestFilter {
  private final long limit;

  RequestSizeFilter(@Value("${precedent.limits.request-bytes}") long limit) {
    this.limit = limit;
  }

  @Override
  protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response,
      FilterChain chain) throws ServletException, IOException {
    if (request.getContentLengthLong() > limit) {
      response.setStatus(413);
      response.setContentType("application/problem+json");
      response.getWriter().write("{\"type\":\"about:blank\",\"title\":\"Content Too Large\","
          + "\"status\":413,\"detail\":\"the request body has " + request.getContentLengthLong()
          + " bytes; at most " + limit + " are accepted\"}");
      return;
    }
    chain.doFilter(new Limited(request, limit), response);
  }

  /** Thrown while reading a body that turned out too large; the error advice makes it a 413. */
  static final class TooLarge extends IOException {
    TooLarge(long limit) {
      super("the request body is over " + limit + " bytes, the most accepted");
    }
  }

  private static final class Limited extends HttpServletRequestWrapper {
    private final long limit;

    Limited(HttpServletRequest request, long limit) {
      super(request);
      this.limit = limit;
    }

    @Override
    public ServletInputStream getInputStream() throws IOException {
      ServletInputStream in = super.getInputStream();
      return new ServletInputStream() {
        private long read;

        @Override
        public int read() throws IOException {
          int b = in.read();
          if (b >= 0) {
            count(1);
          }
          return b;
        }

        @Override
        public int read(byte[] buf, int off, int len) throws IOException {
          int n = in.read(buf, off, len);
          if (n > 0) {
            count(n);
          }
          return n;
        }

        private void count(int n) throws IOException {
          read += n;
          if (read > limit) {
            throw new TooLarge(limit);
          }
        }

        @Override
        public boolean isFinished() {
          return in.isFinished();
        }

        @Override
        public boolean isReady() {
          return in.isReady();
        }

        @Override
        public void setReadListener(ReadListener listener) {
          in.setReadListener(listener);
        }
      };
    }
  }
}
