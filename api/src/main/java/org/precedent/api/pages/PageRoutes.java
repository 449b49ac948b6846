package org.precedent.api.pages;

import org.springframework.context.annotation.Configuration;
import org.springframework.web.servlet.config.annotation.ViewControllerRegistry;
import org.springframework.web.servlet.config.annotation.WebMvcConfigurer;

/**
 * Short addresses for the pages. The pages themselves are static files under {@code /pages/}: the
 * browser fetches the API with the credentials the person typed, so no page is rendered on the
 * server and no data is ever written into markup there.
 */
@Configuration
class PageRoutes implements WebMvcConfigurer {
  @Override
  public void addViewControllers(ViewControllerRegistry registry) {
    registry.addViewController("/").setViewName("forward:/pages/index.html");
    registry.addViewController("/answers").setViewName("forward:/pages/answers.html");
    registry.addViewController("/manage").setViewName("forward:/pages/manage.html");
    registry.addViewController("/library").setViewName("forward:/pages/library.html");
    registry.addViewController("/queue").setViewName("forward:/pages/queue.html");
  }
}
