package org.viscarta.report;

/**
 * A figure rendered for writing.
 *
 * @param stem    file name without extension
 * @param caption what it shows
 * @param png     PNG bytes at 200 dpi
 * @param svg     SVG text
 * @param aspect  height over width, so that the figure keeps its shape where it is placed
 */
public record RenderedFigure(String stem, String caption, byte[] png, String svg, double aspect) {
}
